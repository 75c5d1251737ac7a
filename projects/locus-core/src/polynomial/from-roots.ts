import type { Complex } from '../complex/complex';

/**
 * Monic real polynomial with the given roots, highest power first. Complex roots must come in
 * conjugate pairs; the imaginary parts of the product are dropped (they cancel in exact arithmetic).
 * Example: fromRoots([{re: −1, im: 0}, {re: −2, im: 0}]) = [1, 3, 2].
 */
export function fromRoots(roots: readonly Complex[]): number[] {
  let re: number[] = [1];
  let im: number[] = [0];
  for (const r of roots) {
    const nre = new Array<number>(re.length + 1).fill(0);
    const nim = new Array<number>(re.length + 1).fill(0);
    for (let i = 0; i < re.length; i++) {
      nre[i] += re[i];
      nim[i] += im[i];
      // multiply by (x − r): the shifted term −r·c goes one power lower
      nre[i + 1] -= re[i] * r.re - im[i] * r.im;
      nim[i + 1] -= re[i] * r.im + im[i] * r.re;
    }
    re = nre;
    im = nim;
  }
  return re;
}
