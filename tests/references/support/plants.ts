import type { C } from './assignment';
import type { Draw } from './random';

/**
 * A random set of n roots closed under conjugation, all within the annulus [0.2, 3]·scale, every two
 * at least `separation`·scale apart, complex ones at least 0.15·scale off the real axis, and at least
 * `separation`·scale from every point of `avoid`. Drawn by rejection, deterministic for a given Draw.
 */
export function separatedRoots(draw: Draw, n: number, scale: number, separation = 0.3, avoid: readonly C[] = []): C[] {
  for (let attempt = 0; attempt < 10000; attempt++) {
    const out: C[] = [];
    let ok = true;
    while (out.length < n && ok) {
      const complex = n - out.length >= 2 && draw.uniform(0, 1) < 0.6;
      let tries = 0;
      let placed = false;
      while (tries++ < 200 && !placed) {
        const r = draw.uniform(0.2, 3) * scale;
        const angle = complex ? draw.uniform(0.06, Math.PI - 0.06) : draw.uniform(0, 1) < 0.7 ? Math.PI : 0;
        const candidate = { re: r * Math.cos(angle), im: complex ? r * Math.sin(angle) : 0 };
        if (complex && candidate.im < 0.15 * scale) continue;
        const others = [...out, ...avoid];
        const far = (p: C): boolean => others.every((q) => Math.hypot(q.re - p.re, q.im - p.im) >= separation * scale);
        const mirror = { re: candidate.re, im: -candidate.im };
        if (!far(candidate) || (complex && !far(mirror))) continue;
        out.push(candidate);
        if (complex) out.push(mirror);
        placed = true;
      }
      if (!placed) ok = false;
    }
    if (ok && out.length === n) return out;
  }
  throw new Error(`could not place ${n} separated roots`);
}
