/** A complex number as plain JSON: `{ re, im }`. */
export interface Complex {
  readonly re: number;
  readonly im: number;
}

/** Argument of a in radians, in (−π, π]. */
export function arg(a: Complex): number {
  return Math.atan2(a.im, a.re);
}

/** r·e^{jθ}. */
export function fromPolar(r: number, theta: number): Complex {
  return { re: r * Math.cos(theta), im: r * Math.sin(theta) };
}

/** e^{a}. Example: exp({re: 0, im: π}) ≈ {re: −1, im: 0}. */
export function exp(a: Complex): Complex {
  return fromPolar(Math.exp(a.re), a.im);
}
