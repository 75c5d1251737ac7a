/** A complex number as plain JSON: `{ re, im }`. */
export interface Complex {
  readonly re: number;
  readonly im: number;
}

/** Builds a complex number. */
export function complex(re: number, im = 0): Complex {
  return { re, im };
}

/** Sum a + b. */
export function add(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

/** Difference a − b. */
export function sub(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

/** Product a·b. */
export function mul(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

/** Quotient a / b, computed with Smith's scaling so that it neither overflows nor underflows early. */
export function div(a: Complex, b: Complex): Complex {
  // Smith (1962), "Algorithm 116: Complex division", CACM 5(8).
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

/** Modulus |a|. */
export function abs(a: Complex): number {
  return Math.hypot(a.re, a.im);
}

/** Argument of a in radians, in (−π, π]. */
export function arg(a: Complex): number {
  return Math.atan2(a.im, a.re);
}

/** Complex conjugate. */
export function conj(a: Complex): Complex {
  return { re: a.re, im: -a.im };
}

/** r·e^{jθ}. */
export function fromPolar(r: number, theta: number): Complex {
  return { re: r * Math.cos(theta), im: r * Math.sin(theta) };
}

/** e^{a}. Example: exp({re: 0, im: π}) ≈ {re: −1, im: 0}. */
export function exp(a: Complex): Complex {
  return fromPolar(Math.exp(a.re), a.im);
}

/** Principal natural logarithm ln a (imaginary part in (−π, π]). */
export function log(a: Complex): Complex {
  return { re: Math.log(abs(a)), im: arg(a) };
}

/** Distance |a − b|. */
export function distance(a: Complex, b: Complex): number {
  return Math.hypot(a.re - b.re, a.im - b.im);
}
