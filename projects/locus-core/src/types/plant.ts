import type { Complex } from '../complex/complex';

/** Where the loop lives: continuous time (s-plane) or sampled data (z-plane). */
export type Domain = 's' | 'z';

/** Fields every plant form shares. */
export interface PlantCommon {
  /** `"s"` (default) or `"z"`; a z-plant needs `sampleTime`. */
  readonly domain?: Domain;
  /** Sampling period in seconds, required when `domain` is `"z"`. */
  readonly sampleTime?: number;
  /** Dead time in seconds (s-domain only), replaced by a Padé approximant or handled exactly by `discretize`. */
  readonly deadTime?: number;
  /** Order of the Padé approximant used for `deadTime` (1–10, default 3). */
  readonly padeOrder?: number;
  /** Turns a continuous plant into its zero-order-hold equivalent at this sampling period. */
  readonly discretize?: { readonly sampleTime: number };
}

/** Transfer function as coefficient lists, highest power first. */
export interface CoefficientPlant extends PlantCommon {
  readonly numerator: readonly number[];
  readonly denominator: readonly number[];
}

/** Transfer function as gain · Π(x − zᵢ) / Π(x − pᵢ); complex values in conjugate pairs. */
export interface FactoredPlant extends PlantCommon {
  readonly zeros: readonly Complex[];
  readonly poles: readonly Complex[];
  readonly gain: number;
}

/** Transfer function as a rational expression in `s` (or `z`), e.g. `"4*(s+2)/(s*(s+1)*(s^2+6*s+25))"`. */
export interface ExpressionPlant extends PlantCommon {
  readonly expression: string;
}

/** A plant in any of the three accepted forms. */
export type Plant = CoefficientPlant | FactoredPlant | ExpressionPlant;

/** A finding that does not stop the computation but that the engineer should read. */
export interface Warning {
  /** Stable machine-readable code, e.g. `hidden-unstable-mode`. */
  readonly code: string;
  /** Plain-language explanation. */
  readonly message: string;
}

/** A plant reduced to the one form the engine works on. */
export interface NormalizedPlant {
  /** Open-loop numerator N, highest power first, leading coefficient non-zero. */
  readonly numerator: readonly number[];
  /** Open-loop denominator D, highest power first, leading coefficient non-zero. */
  readonly denominator: readonly number[];
  readonly domain: Domain;
  /** Sampling period in seconds for z-plants, `null` for s-plants. */
  readonly sampleTime: number | null;
  /** What was noticed while normalising (cancellations, approximations). */
  readonly warnings: readonly Warning[];
}
