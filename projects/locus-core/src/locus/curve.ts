import type { Complex } from '../complex/complex';

/**
 * A curve of the plane given as the image of the real line under x(t) = (αt + β)/(γt + δ):
 * straight lines (γ = 0) and circles. `atInfinity` is the point reached as t → ±∞ on a circle.
 */
export interface Curve {
  readonly alpha: Complex;
  readonly beta: Complex;
  readonly gamma: Complex;
  readonly delta: Complex;
  /** Only parameters t ≥ 0 belong to the curve (a ray). */
  readonly isRay?: boolean;
}

/** The imaginary axis x = j·t. */
export const IMAGINARY_AXIS: Curve = { alpha: { re: 0, im: 1 }, beta: { re: 0, im: 0 }, gamma: { re: 0, im: 0 }, delta: { re: 1, im: 0 } };

/** The vertical line Re x = σ. */
export function verticalLine(sigma: number): Curve {
  return { alpha: { re: 0, im: 1 }, beta: { re: sigma, im: 0 }, gamma: { re: 0, im: 0 }, delta: { re: 1, im: 0 } };
}

/** The ray of constant damping ratio ζ in the upper half-plane: x = t·(−ζ + j√(1−ζ²)), t ≥ 0. */
export function dampingRay(zeta: number): Curve {
  return {
    alpha: { re: -zeta, im: Math.sqrt(Math.max(0, 1 - zeta * zeta)) },
    beta: { re: 0, im: 0 },
    gamma: { re: 0, im: 0 },
    delta: { re: 1, im: 0 },
    isRay: true,
  };
}

/**
 * The circle |x − c| = R (c real) as x = c + R·(1 + jt)/(1 − jt); t = 0 is c + R and t → ∞ is c − R.
 */
export function circle(center: number, radius: number): Curve {
  return {
    alpha: { re: 0, im: radius - center },
    beta: { re: center + radius, im: 0 },
    gamma: { re: 0, im: -1 },
    delta: { re: 1, im: 0 },
  };
}

/** The point of the curve at parameter t. */
export function pointAt(curve: Curve, t: number): Complex {
  const nr = curve.alpha.re * t + curve.beta.re;
  const ni = curve.alpha.im * t + curve.beta.im;
  const dr = curve.gamma.re * t + curve.delta.re;
  const di = curve.gamma.im * t + curve.delta.im;
  const d = dr * dr + di * di;
  return { re: (nr * dr + ni * di) / d, im: (ni * dr - nr * di) / d };
}

/** The point reached as t → ∞ (α/γ), or `null` for a line. */
export function pointAtInfinity(curve: Curve): Complex | null {
  const { gamma, alpha } = curve;
  const d = gamma.re * gamma.re + gamma.im * gamma.im;
  if (d === 0) return null;
  return { re: (alpha.re * gamma.re + alpha.im * gamma.im) / d, im: (alpha.im * gamma.re - alpha.re * gamma.im) / d };
}

/** dx/dt = (αδ − βγ)/(γt + δ)². */
export function slopeAt(curve: Curve, t: number): Complex {
  const { alpha, beta, gamma, delta } = curve;
  const nr = alpha.re * delta.re - alpha.im * delta.im - (beta.re * gamma.re - beta.im * gamma.im);
  const ni = alpha.re * delta.im + alpha.im * delta.re - (beta.re * gamma.im + beta.im * gamma.re);
  const dr = gamma.re * t + delta.re;
  const di = gamma.im * t + delta.im;
  const sr = dr * dr - di * di;
  const si = 2 * dr * di;
  const d = sr * sr + si * si;
  return { re: (nr * sr + ni * si) / d, im: (ni * sr - nr * si) / d };
}

/** The curve parameter t of a point on (or near) the curve: the real part of (δx − β)/(α − γx). */
export function parameterOf(curve: Curve, x: Complex): number {
  const { alpha, beta, gamma, delta } = curve;
  const nr = delta.re * x.re - delta.im * x.im - beta.re;
  const ni = delta.re * x.im + delta.im * x.re - beta.im;
  const dr = alpha.re - (gamma.re * x.re - gamma.im * x.im);
  const di = alpha.im - (gamma.re * x.im + gamma.im * x.re);
  const d = dr * dr + di * di;
  return (nr * dr + ni * di) / d;
}
