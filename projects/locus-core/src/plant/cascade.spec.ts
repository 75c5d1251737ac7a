import { describe, expect, it } from 'vitest';
import type { Complex } from '../complex/complex';
import { solveComplex } from '../numeric/complex-solve';
import { realizeCascade } from './cascade';
import type { StateSpace } from './state-space';

/** C(sI − A)⁻¹B + D at a complex point, by a linear solve (independent of how the model was built). */
function response(model: StateSpace, s: Complex): Complex {
  const n = model.a.length;
  const ar = model.a.map((row, i) => row.map((v, j) => (i === j ? s.re : 0) - v));
  const ai = model.a.map((row, i) => row.map((_, j) => (i === j ? s.im : 0)));
  const x = solveComplex(ar, ai, model.b, new Array<number>(n).fill(0));
  if (!x) throw new Error('singular');
  let re = model.d;
  let im = 0;
  for (let i = 0; i < n; i++) {
    re += model.c[i] * x.re[i];
    im += model.c[i] * x.im[i];
  }
  return { re, im };
}

/** gain·Π(s − z)/Π(s − p) evaluated from the factors directly. */
function factored(gain: number, zeros: Complex[], poles: Complex[], s: Complex): Complex {
  let re = gain;
  let im = 0;
  const times = (f: Complex, divide: boolean): void => {
    const dr = s.re - f.re;
    const di = s.im - f.im;
    if (!divide) {
      [re, im] = [re * dr - im * di, re * di + im * dr];
    } else {
      const d = dr * dr + di * di;
      [re, im] = [(re * dr + im * di) / d, (im * dr - re * di) / d];
    }
  };
  zeros.forEach((z) => times(z, false));
  poles.forEach((p) => times(p, true));
  return { re, im };
}

describe('realizeCascade', () => {
  const cases: { name: string; gain: number; zeros: Complex[]; poles: Complex[] }[] = [
    { name: 'a first-order lag', gain: 2, zeros: [], poles: [{ re: -1, im: 0 }] },
    { name: 'a biproper lead', gain: 3, zeros: [{ re: -2, im: 0 }], poles: [{ re: -20, im: 0 }] },
    { name: 'a double integrator with a lead zero', gain: 1, zeros: [{ re: -0.5, im: 0 }], poles: [{ re: 0, im: 0 }, { re: 0, im: 0 }, { re: -9, im: 0 }] },
    {
      name: 'complex zeros over real poles only',
      gain: 0.7,
      zeros: [{ re: -1, im: 3 }, { re: -1, im: -3 }],
      poles: [{ re: -0.5, im: 0 }, { re: -4, im: 0 }, { re: -30, im: 0 }],
    },
    {
      name: 'a wide-band eighth-order loop',
      gain: 1e6,
      zeros: [{ re: -3, im: 0 }, { re: -200, im: 0 }, { re: -0.5, im: 40 }, { re: -0.5, im: -40 }],
      poles: [
        { re: -0.01, im: 0 }, { re: -1, im: 0 }, { re: -150, im: 900 }, { re: -150, im: -900 },
        { re: -2, im: 35 }, { re: -2, im: -35 }, { re: -5000, im: 0 }, { re: -80, im: 0 },
      ],
    },
  ];
  for (const c of cases) {
    it(`reproduces the transfer function of ${c.name} at points across the band`, () => {
      const model = realizeCascade(c.gain, c.zeros, c.poles);
      expect(model.a.length).toBe(c.poles.length);
      for (const s of [{ re: 0.3, im: 0.1 }, { re: -0.2, im: 7 }, { re: 10, im: 400 }, { re: 1, im: 1e4 }]) {
        const got = response(model, s);
        const want = factored(c.gain, c.zeros, c.poles, s);
        const scale = Math.hypot(want.re, want.im);
        expect(Math.hypot(got.re - want.re, got.im - want.im)).toBeLessThanOrEqual(1e-10 * scale);
      }
    });
  }
});
