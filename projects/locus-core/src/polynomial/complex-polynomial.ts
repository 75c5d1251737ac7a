import type { Complex } from '../complex/complex';
import type { Polynomial } from './polynomial';

/** A polynomial with complex coefficients, highest power first, as two parallel arrays. */
export interface ComplexPolynomial {
  readonly re: number[];
  readonly im: number[];
}

/** Product of two complex polynomials. */
export function multiplyComplex(p: ComplexPolynomial, q: ComplexPolynomial): ComplexPolynomial {
  const length = p.re.length + q.re.length - 1;
  const re = new Array<number>(length).fill(0);
  const im = new Array<number>(length).fill(0);
  for (let i = 0; i < p.re.length; i++) {
    for (let j = 0; j < q.re.length; j++) {
      re[i + j] += p.re[i] * q.re[j] - p.im[i] * q.im[j];
      im[i + j] += p.re[i] * q.im[j] + p.im[i] * q.re[j];
    }
  }
  return { re, im };
}

/**
 * Composes a real polynomial of formal degree n with the Möbius map x = (αt + β)/(γt + δ) and clears
 * the denominator: returns Σ_k a_k·(αt + β)^k·(γt + δ)^{n−k} as a complex polynomial in t.
 * With γ = 0 and δ = 1 this is the substitution of the line x = αt + β.
 */
export function composeMobius(p: Polynomial, n: number, alpha: Complex, beta: Complex, gamma: Complex, delta: Complex): ComplexPolynomial {
  const top: ComplexPolynomial[] = [{ re: [1], im: [0] }];
  const bottom: ComplexPolynomial[] = [{ re: [1], im: [0] }];
  const topFactor = { re: [alpha.re, beta.re], im: [alpha.im, beta.im] };
  const bottomFactor = { re: [gamma.re, delta.re], im: [gamma.im, delta.im] };
  for (let k = 1; k <= n; k++) {
    top.push(multiplyComplex(top[k - 1], topFactor));
    bottom.push(multiplyComplex(bottom[k - 1], bottomFactor));
  }
  const re = new Array<number>(n + 1).fill(0);
  const im = new Array<number>(n + 1).fill(0);
  for (let i = 0; i < p.length; i++) {
    const k = p.length - 1 - i;
    if (p[i] === 0) continue;
    const term = multiplyComplex(top[k], bottom[n - k]);
    const offset = n + 1 - term.re.length;
    for (let j = 0; j < term.re.length; j++) {
      re[offset + j] += p[i] * term.re[j];
      im[offset + j] += p[i] * term.im[j];
    }
  }
  return { re, im };
}

/** p(t)·conj(q)(t) for real t, where conj conjugates the coefficients of q. */
export function multiplyConjugate(p: ComplexPolynomial, q: ComplexPolynomial): ComplexPolynomial {
  return multiplyComplex(p, { re: q.re, im: q.im.map((v) => -v) });
}
