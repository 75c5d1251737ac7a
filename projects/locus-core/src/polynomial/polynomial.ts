/**
 * A real polynomial as its coefficients, **highest power first**: `[1, 3, 2]` is s² + 3s + 2.
 * This order is used everywhere in the core and in the JSON contract.
 */
export type Polynomial = readonly number[];

/** Drops leading zero coefficients; the zero polynomial becomes `[]`. */
export function trim(p: Polynomial): number[] {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  return p.slice(start);
}

/** Sum p + q (aligned at the constant term). */
export function add(p: Polynomial, q: Polynomial): number[] {
  const n = Math.max(p.length, q.length);
  const out = new Array<number>(n).fill(0);
  for (let i = 0; i < p.length; i++) out[n - p.length + i] += p[i];
  for (let i = 0; i < q.length; i++) out[n - q.length + i] += q[i];
  return out;
}

/** c·p. */
export function scale(p: Polynomial, c: number): number[] {
  return p.map((a) => a * c);
}

/**
 * Product p·q (convolution of the coefficient lists, highest power first).
 * Example: multiply([1, 1], [1, 2]) = [1, 3, 2], i.e. (s + 1)(s + 2) = s² + 3s + 2.
 */
export function multiply(p: Polynomial, q: Polynomial): number[] {
  if (p.length === 0 || q.length === 0) return [];
  const out = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) out[i + j] += p[i] * q[j];
  return out;
}

/** Polynomial power p^k for a whole k ≥ 0. */
export function power(p: Polynomial, k: number): number[] {
  let out: number[] = [1];
  for (let i = 0; i < k; i++) out = multiply(out, p);
  return out;
}

/** Pads p with leading zeros to `length` coefficients. */
export function padTo(p: Polynomial, length: number): number[] {
  return [...new Array<number>(Math.max(0, length - p.length)).fill(0), ...p];
}

/** Derivative dp/dx. Example: derivative([1, 3, 2]) = [2, 3]. */
export function derivative(p: Polynomial): number[] {
  const n = p.length - 1;
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(p[i] * (n - i));
  return out;
}
