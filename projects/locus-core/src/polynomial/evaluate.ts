import type { Complex } from '../complex/complex';
import type { Polynomial } from './polynomial';

/** p(x) for real x by Horner's rule. Example: evaluate([1, 3, 2], 1) = 6. */
export function evaluate(p: Polynomial, x: number): number {
  let acc = 0;
  for (const a of p) acc = acc * x + a;
  return acc;
}

/** p(z) for complex z by Horner's rule. */
export function evaluateComplex(p: Polynomial, z: Complex): Complex {
  let re = 0;
  let im = 0;
  for (const a of p) {
    const r = re * z.re - im * z.im + a;
    im = re * z.im + im * z.re;
    re = r;
  }
  return { re, im };
}

/** p(z) and p′(z) together for complex z (Horner with the derivative carried along). */
export function evaluateWithDerivative(p: Polynomial, z: Complex): { value: Complex; slope: Complex } {
  let re = 0;
  let im = 0;
  let dre = 0;
  let dim = 0;
  for (const a of p) {
    const nd = dre * z.re - dim * z.im + re;
    dim = dre * z.im + dim * z.re + im;
    dre = nd;
    const r = re * z.re - im * z.im + a;
    im = re * z.im + im * z.re;
    re = r;
  }
  return { value: { re, im }, slope: { re: dre, im: dim } };
}

/** Σ|a_k|·|z|^k: the scale against which a residual |p(z)| is judged (backward-error bound). */
export function evaluateAbs(p: Polynomial, modulus: number): number {
  let acc = 0;
  for (const a of p) acc = acc * modulus + Math.abs(a);
  return acc;
}

/**
 * Scaled residual |p(z)| / Σ|a_k||z|^k of a claimed root z: near machine epsilon for a root that is
 * exact for slightly perturbed coefficients (Wilkinson's backward error).
 */
export function scaledResidual(p: Polynomial, z: Complex): number {
  const v = evaluateComplex(p, z);
  const bound = evaluateAbs(p, Math.hypot(z.re, z.im));
  return bound === 0 ? 0 : Math.hypot(v.re, v.im) / bound;
}
