import type { Complex } from './complex';

/**
 * Whether every non-real value in the list has its conjugate in the list with the same multiplicity.
 * `tolerance` is relative to the larger modulus of the pair (plus an absolute floor of the same size).
 */
export function hasCompleteConjugatePairs(values: readonly Complex[], tolerance = 1e-9): boolean {
  const used = new Array<boolean>(values.length).fill(false);
  for (let i = 0; i < values.length; i++) {
    if (used[i]) continue;
    const v = values[i];
    const scale = Math.max(1, Math.hypot(v.re, v.im));
    if (Math.abs(v.im) <= tolerance * scale) {
      used[i] = true;
      continue;
    }
    let match = -1;
    for (let j = i + 1; j < values.length; j++) {
      if (used[j]) continue;
      const w = values[j];
      if (Math.abs(w.re - v.re) <= tolerance * scale && Math.abs(w.im + v.im) <= tolerance * scale) {
        match = j;
        break;
      }
    }
    if (match < 0) return false;
    used[i] = true;
    used[match] = true;
  }
  return true;
}

/**
 * Makes a list of roots of a real polynomial exactly conjugate-symmetric: values with a tiny imaginary
 * part become real, each complex value is paired with the value nearest its conjugate and both are
 * averaged, and a value with no partner nearer its conjugate than it is to the real axis becomes real.
 */
export function symmetrize(values: readonly Complex[], realTolerance = 1e-10): Complex[] {
  const out: Complex[] = values.map((v) => ({ re: v.re, im: v.im }));
  const done = new Array<boolean>(out.length).fill(false);
  for (let i = 0; i < out.length; i++) {
    if (done[i]) continue;
    const v = out[i];
    const scale = Math.max(1e-300, Math.hypot(v.re, v.im));
    if (Math.abs(v.im) <= realTolerance * scale) {
      out[i] = { re: v.re, im: 0 };
      done[i] = true;
      continue;
    }
    let best = -1;
    let bestDistance = Infinity;
    for (let j = 0; j < out.length; j++) {
      if (j === i || done[j]) continue;
      const d = Math.hypot(out[j].re - v.re, out[j].im + v.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = j;
      }
    }
    if (best < 0 || bestDistance >= Math.abs(v.im)) {
      // no partner closer to the conjugate than the value is to the real axis: a real root with
      // rounding noise in its imaginary part
      out[i] = { re: v.re, im: 0 };
      done[i] = true;
      continue;
    }
    const re = (v.re + out[best].re) / 2;
    const im = (Math.abs(v.im) + Math.abs(out[best].im)) / 2;
    out[i] = { re, im: v.im >= 0 ? im : -im };
    out[best] = { re, im: v.im >= 0 ? -im : im };
    done[i] = true;
    done[best] = true;
  }
  return out;
}
