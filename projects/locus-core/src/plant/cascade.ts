import type { Complex } from '../complex/complex';
import type { StateSpace } from './state-space';

/** One first- or second-order section: numerator and denominator, highest power first, denominator monic. */
interface Section {
  readonly num: number[];
  readonly den: number[];
}

/**
 * State-space realisation of gain·Π(s − zᵢ)/Π(s − pⱼ) as a cascade of first- and second-order sections
 * built from the poles and zeros themselves. Unlike a companion form of the expanded polynomial, whose
 * entries span many orders of magnitude at high degree, every section here is scaled to its own
 * natural frequency and to unit gain there, so the realisation stays well conditioned at any order.
 * Complex values must come in conjugate pairs; there may be no more zeros than poles.
 * Example: realizeCascade(2, [], [{re: −1, im: 0}]) realises 2/(s + 1).
 */
export function realizeCascade(gain: number, zeros: readonly Complex[], poles: readonly Complex[]): StateSpace {
  const denominators = factors(poles);
  const numerators = factors(zeros);
  const sections: Section[] = denominators.map((den) => ({ num: [1], den }));
  // quadratic numerators go to quadratic sections, in order; a linear one to a section with room
  const quadraticNums = numerators.filter((f) => f.length === 3);
  const linearNums = numerators.filter((f) => f.length === 2);
  let next = 0;
  for (const q of quadraticNums) {
    while (sections[next].den.length !== 3) next++;
    sections[next] = { num: q, den: sections[next].den };
    next++;
  }
  for (const l of linearNums) {
    const free = sections.findIndex((s) => s.num.length === 1 && s.den.length === 2);
    const index = free >= 0 ? free : sections.findIndex((s) => s.num.length === 1);
    sections[index] = { num: l, den: sections[index].den };
  }
  let remaining = gain;
  let model: StateSpace = { a: [], b: [], c: [], d: 1 };
  for (const section of sections) {
    const scale = gainAtNaturalFrequency(section);
    remaining *= scale;
    model = series(model, realizeSection({ num: section.num.map((v) => v / scale), den: section.den }));
  }
  return { a: model.a, b: model.b, c: model.c.map((v) => v * remaining), d: model.d * remaining };
}

/** Real factors of Π(s − rᵢ): conjugate pairs and pairs of real roots as quadratics, one linear left over. */
function factors(roots: readonly Complex[]): number[][] {
  const out: number[][] = [];
  const reals: number[] = [];
  for (const r of roots) {
    if (r.im > 0) out.push([1, -2 * r.re, r.re * r.re + r.im * r.im]);
    else if (r.im === 0) reals.push(r.re);
  }
  reals.sort((a, b) => a - b);
  for (let i = 0; i + 1 < reals.length; i += 2) out.push([1, -(reals[i] + reals[i + 1]), reals[i] * reals[i + 1]]);
  if (reals.length % 2 === 1) out.push([1, -reals[reals.length - 1]]);
  return out;
}

function naturalFrequency(den: readonly number[]): number {
  const w = den.length === 3 ? Math.sqrt(Math.abs(den[2])) : Math.abs(den[1]);
  return w > 0 ? w : den.length === 3 && den[1] !== 0 ? Math.abs(den[1]) : 1;
}

function gainAtNaturalFrequency(section: Section): number {
  const w = naturalFrequency(section.den);
  const at = (p: readonly number[]): number => {
    let re = 0;
    let im = 0;
    for (const c of p) {
      const r = -im * w + c;
      im = re * w;
      re = r;
    }
    return Math.hypot(re, im);
  };
  const g = at(section.num) / at(section.den);
  return Number.isFinite(g) && g > 0 ? g : 1;
}

/** A section scaled by its natural frequency ω: A = [[−a₁, −a₀/ω], [ω, 0]] for a quadratic. */
function realizeSection({ num, den }: Section): StateSpace {
  if (den.length === 2) {
    const b1 = num.length === 2 ? num[0] : 0;
    const b0 = num[num.length - 1];
    return { a: [[-den[1]]], b: [1], c: [b0 - b1 * den[1]], d: b1 };
  }
  const padded = [0, 0, ...num].slice(-3);
  const [b2, b1, b0] = padded;
  const w = naturalFrequency(den);
  return { a: [[-den[1], -den[2] / w], [w, 0]], b: [1, 0], c: [b1 - b2 * den[1], (b0 - b2 * den[2]) / w], d: b2 };
}

/** The series connection first → second. */
function series(first: StateSpace, second: StateSpace): StateSpace {
  const n1 = first.a.length;
  const n2 = second.a.length;
  const a: number[][] = [];
  for (let i = 0; i < n1; i++) a.push([...first.a[i], ...new Array<number>(n2).fill(0)]);
  for (let i = 0; i < n2; i++) a.push([...first.c.map((c) => second.b[i] * c), ...second.a[i]]);
  return {
    a,
    b: [...first.b, ...second.b.map((b) => b * first.d)],
    c: [...first.c.map((c) => second.d * c), ...second.c],
    d: first.d * second.d,
  };
}
