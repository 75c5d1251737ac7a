/**
 * The tests' own small polynomial arithmetic, independent of the engine's (coefficients highest power
 * first, as everywhere in the project).
 */
export type Poly = number[];

export function polyTrim(p: readonly number[]): Poly {
  let i = 0;
  while (i < p.length - 1 && p[i] === 0) i++;
  return p.slice(i);
}

export function polyAdd(p: readonly number[], q: readonly number[]): Poly {
  const n = Math.max(p.length, q.length);
  const out = new Array<number>(n).fill(0);
  p.forEach((c, i) => (out[n - p.length + i] += c));
  q.forEach((c, i) => (out[n - q.length + i] += c));
  return out;
}

export function polyScale(p: readonly number[], c: number): Poly {
  return p.map((v) => v * c);
}

export function polySub(p: readonly number[], q: readonly number[]): Poly {
  return polyAdd(p, polyScale(q, -1));
}

export function polyMul(p: readonly number[], q: readonly number[]): Poly {
  const out = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) out[i + j] += p[i] * q[j];
  return out;
}

/** Monic product Π(x − rᵢ) over real roots. */
export function polyFromRealRoots(rs: readonly number[]): Poly {
  return rs.reduce<Poly>((acc, r) => polyMul(acc, [1, -r]), [1]);
}

export function polyEval(p: readonly number[], x: number): number {
  return p.reduce((acc, c) => acc * x + c, 0);
}

export function polyEvalComplex(p: readonly number[], re: number, im: number): { re: number; im: number } {
  let ar = 0;
  let ai = 0;
  for (const c of p) {
    const r = ar * re - ai * im + c;
    ai = ar * im + ai * re;
    ar = r;
  }
  return { re: ar, im: ai };
}

/** p padded with leading zeros to `length` coefficients. */
export function polyPad(p: readonly number[], length: number): Poly {
  return [...new Array<number>(Math.max(0, length - p.length)).fill(0), ...p];
}

/** Determinant of a square matrix whose entries are polynomials, by cofactor expansion (small n only). */
export function polyDeterminant(m: readonly (readonly Poly[])[]): Poly {
  const n = m.length;
  if (n === 0) return [1];
  if (n === 1) return m[0][0];
  let acc: Poly = [0];
  for (let j = 0; j < n; j++) {
    if (m[0][j].every((c) => c === 0)) continue;
    const minor = m.slice(1).map((row) => row.filter((_, k) => k !== j));
    const term = polyMul(m[0][j], polyDeterminant(minor));
    acc = j % 2 === 0 ? polyAdd(acc, term) : polySub(acc, term);
  }
  return polyTrim(acc);
}
