/** Machine epsilon for IEEE-754 double precision. */
export const EPSILON = Number.EPSILON;

/**
 * Whether a and b agree to a relative tolerance, with an absolute floor for values near zero.
 * NaN never agrees with anything; equal infinities agree.
 */
export function isClose(a: number, b: number, relative = 1e-9, absolute = relative): boolean {
  if (Number.isNaN(a) || Number.isNaN(b)) return false;
  if (a === b) return true;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return false;
  return Math.abs(a - b) <= Math.max(absolute, relative * Math.max(Math.abs(a), Math.abs(b)));
}
