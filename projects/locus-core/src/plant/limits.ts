/** Highest denominator degree the engine accepts (after dead-time approximation and discretisation). */
export const MAX_DEGREE = 60;
/** Highest Padé order accepted. */
export const MAX_PADE_ORDER = 10;
/** Padé order used when a plant gives `deadTime` without `padeOrder`. */
export const DEFAULT_PADE_ORDER = 3;
