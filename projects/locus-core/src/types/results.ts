import type { Complex } from '../complex/complex';
import type { Plant, Warning } from './plant';

/** Open interval of gain K; `to: null` means unbounded. */
export interface GainRange {
  readonly from: number;
  readonly to: number | null;
  /** The interior gain at which the interval was certified. */
  readonly checkedAt?: number;
  /** The exact test that certified it: `routh-hurwitz` (s) or `bilinear-routh-hurwitz` (z), both in exact integer arithmetic. */
  readonly certifiedBy?: 'routh-hurwitz' | 'bilinear-routh-hurwitz';
}

/** Open interval of negative gain K (positive feedback); `from: null` means unbounded below. */
export interface NegativeGainRange {
  readonly from: number | null;
  readonly to: number;
  readonly checkedAt?: number;
  readonly certifiedBy?: 'routh-hurwitz' | 'bilinear-routh-hurwitz';
}

/** One point of a branch: the closed-loop pole at one gain. */
export interface LocusPoint {
  readonly gain: number;
  readonly re: number;
  readonly im: number;
}

/** A gain at which something happens at a point of the plane. */
export interface GainPoint {
  readonly point: Complex;
  readonly gain: number;
}

/** Request of `locus`. */
export interface LocusRequest {
  readonly plant: Plant;
  /** Gain span to trace; chosen automatically when absent. `min < 0` traces positive feedback too. */
  readonly gainRange?: { readonly min?: number; readonly max?: number };
  /** Trace negative gains (positive feedback) as well, over an automatic span. */
  readonly includeNegativeGains?: boolean;
}

/** Result of `locus`. */
export interface LocusResult {
  readonly domain: 's' | 'z';
  readonly sampleTime: number | null;
  /** The plant the engine worked on (after Padé, discretisation, expression parsing). */
  readonly normalizedPlant: { readonly numerator: number[]; readonly denominator: number[] };
  readonly gainSpan: { readonly min: number; readonly max: number };
  /** One polyline per closed-loop pole, points in ascending gain; branch i never swaps with branch j. */
  readonly branches: { readonly points: LocusPoint[] }[];
  readonly openLoop: { readonly poles: Complex[]; readonly zeros: Complex[] };
  readonly asymptotes: { readonly centroid: number; readonly anglesDeg: number[] } | null;
  readonly breakPoints: GainPoint[];
  /** Imaginary-axis crossings (s) or unit-circle crossings (z). */
  readonly crossings: GainPoint[];
  readonly departureAngles: { readonly pole: Complex; readonly angleDeg: number }[];
  readonly arrivalAngles: { readonly zero: Complex; readonly angleDeg: number }[];
  /** The exact set of K > 0 for which the closed loop is stable. */
  readonly stableGainRanges: GainRange[];
  /** The exact set of K < 0 for which it is stable, when negative gains were traced. */
  readonly negativeStableGainRanges?: NegativeGainRange[];
  readonly warnings: Warning[];
  /** The caution that goes with every stability statement. */
  readonly caution: string;
}

/** Request of `closedLoop`. */
export interface ClosedLoopRequest {
  readonly plant: Plant;
  readonly gain: number;
  /** Time span of the step response in seconds (automatic when absent) and the number of samples. */
  readonly step?: { readonly duration?: number; readonly points?: number };
}

/** A closed-loop pole with its usual figures. */
export interface ClosedLoopPole extends Complex {
  /** ζ = −Re(s)/|s| (through s = ln(z)/T for z-plants); 1 for a z-pole at the origin. */
  readonly dampingRatio: number;
  /** ωn = |s| in rad/s; `null` for a z-pole at the origin (infinitely fast). */
  readonly naturalFrequency: number | null;
  /** τ = −1/Re(s) in seconds for a decaying pole, 0 for a z-pole at the origin, `null` otherwise. */
  readonly timeConstant: number | null;
  /** Whether this pole decays (Re s < 0, or |z| < 1). */
  readonly isStable: boolean;
}

/** Unit-step response and its figures; the figures are `null` where they do not exist (unstable loop, zero final value). */
export interface StepResponse {
  readonly time: number[];
  readonly output: number[];
  readonly overshootPct: number | null;
  readonly riseTime: number | null;
  readonly settlingTime: number | null;
  readonly finalValue: number | null;
  readonly peak: { readonly time: number; readonly value: number };
}

/** Result of `closedLoop`. */
export interface ClosedLoopResult {
  readonly gain: number;
  readonly stable: boolean;
  readonly domain: 's' | 'z';
  readonly sampleTime: number | null;
  readonly poles: ClosedLoopPole[];
  readonly step: StepResponse | null;
  readonly warnings: Warning[];
  readonly caution: string;
}

/** Performance targets turned into a region of the plane. */
export interface DesignTargets {
  readonly minDampingRatio?: number;
  /** 2 % settling time in seconds, through the approximation Ts ≈ 4/(ζωn). */
  readonly maxSettlingTime?: number;
  readonly maxOvershootPct?: number;
  /** Band of natural frequency ωn in rad/s. */
  readonly naturalFrequency?: { readonly min?: number; readonly max?: number };
}

/** Request of `designGains`. */
export interface DesignRequest {
  readonly plant: Plant;
  readonly targets?: DesignTargets;
  /** Damping ratios whose constant-damping lines should be intersected with the locus. */
  readonly dampingLines?: readonly number[];
  /** Judge only the dominant (slowest) pole pair instead of every closed-loop pole. */
  readonly dominantOnly?: boolean;
  readonly gainRange?: { readonly min?: number; readonly max?: number };
}

/** Result of `designGains`. */
export interface DesignResult {
  /** Gains K > 0 for which the loop is stable and the judged poles meet every target. */
  readonly gainRanges: GainRange[];
  readonly dampingLineGains: { readonly dampingRatio: number; readonly gains: number[] }[];
  /** The targets as the engine applied them (overshoot turned into a damping ratio, etc.). */
  readonly region: {
    readonly minDampingRatio: number | null;
    readonly minDecayRate: number | null;
    readonly naturalFrequency: { readonly min: number | null; readonly max: number | null };
  };
  readonly stableGainRanges: GainRange[];
  readonly warnings: Warning[];
  readonly caution: string;
}
