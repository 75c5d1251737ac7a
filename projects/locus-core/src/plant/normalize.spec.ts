import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import { ValidationError } from '../errors';
import { roots } from '../polynomial/roots';
import { MAX_DEGREE, normalizePlant } from './normalize';

function expectCoefficients(actual: readonly number[], expected: readonly number[], rel = 1e-14): void {
  expect(actual).toHaveLength(expected.length);
  actual.forEach((a, i) => expectClose(a, expected[i], rel, rel));
}

function pointerOf(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(ValidationError);
    return (error as ValidationError).issues[0]?.pointer;
  }
  return undefined;
}

describe('normalizePlant — low order, the three plant forms', () => {
  it('reduces coefficient, factored and expression forms of 2(s + 2)/(s(s + 1)(s + 2)) to the same monic polynomials', () => {
    // multiplied out by hand: numerator 2s + 4, denominator s³ + 3s² + 2s
    const forms = [
      { numerator: [2, 4], denominator: [1, 3, 2, 0] },
      { zeros: [{ re: -2, im: 0 }], poles: [{ re: 0, im: 0 }, { re: -1, im: 0 }, { re: -2, im: 0 }], gain: 2 },
      { expression: '2*(s+2)/(s*(s+1)*(s+2))' },
    ];
    for (const plant of forms) {
      const n = normalizePlant(plant);
      expectCoefficients(n.numerator, [2, 4]);
      expectCoefficients(n.denominator, [1, 3, 2, 0]);
      expect(n.domain).toBe('s');
      expect(n.sampleTime).toBeNull();
    }
  });

  it('makes the denominator monic by scaling both polynomials by its leading coefficient', () => {
    const n = normalizePlant({ numerator: [6], denominator: [2, 4] });
    expect(n.numerator).toEqual([3]);
    expect(n.denominator).toEqual([1, 2]);
  });

  it('drops leading zero coefficients before judging the degrees', () => {
    const n = normalizePlant({ numerator: [0, 0, 3], denominator: [0, 1, 2] });
    expect(n.numerator).toEqual([3]);
    expect(n.denominator).toEqual([1, 2]);
  });

  it('multiplies out complex factored poles in conjugate pairs into real coefficients', () => {
    // (s + 1 − 2j)(s + 1 + 2j) = s² + 2s + 5
    const n = normalizePlant({ zeros: [], poles: [{ re: -1, im: 2 }, { re: -1, im: -2 }], gain: 3 });
    expectCoefficients(n.denominator, [1, 2, 5]);
    expect(n.numerator).toEqual([3]);
  });

  it('takes a missing imaginary part of a factored root as zero and a missing zeros list as none', () => {
    const n = normalizePlant({ poles: [{ re: -4 }], gain: 1 } as never);
    expect(n.denominator).toEqual([1, 4]);
    expect(n.numerator).toEqual([1]);
  });
});

describe('normalizePlant — dead time and sampling', () => {
  it('replaces dead time by the first-order Padé approximant (1 − sT/2)/(1 + sT/2) when asked for order 1', () => {
    // T = 0.5: (1 − 0.25s)/(1 + 0.25s) times 1/(s + 1) → (−s + 4)/(s² + 5s + 4) after making D monic
    const n = normalizePlant({ numerator: [1], denominator: [1, 1], deadTime: 0.5, padeOrder: 1 });
    expectCoefficients(n.numerator, [-1, 4]);
    expectCoefficients(n.denominator, [1, 5, 4]);
    expect(n.warnings.map((w) => w.code)).toContain('dead-time-approximated');
  });

  it('uses a third-order approximant by default, adding three poles and three zeros', () => {
    const n = normalizePlant({ numerator: [1], denominator: [1, 1], deadTime: 0.2 });
    expect(n.denominator).toHaveLength(1 + 4);
    expect(n.numerator).toHaveLength(1 + 3);
    // the Padé approximant of e^{−sT} is all-pass: its zeros mirror its poles across the imaginary axis
    const approximantPoles = roots(n.denominator).filter((p) => Math.hypot(p.re + 1, p.im) > 1e-6);
    const zeros = roots(n.numerator);
    for (const p of approximantPoles) {
      expect(p.re).toBeLessThan(0);
      expect(zeros.some((z) => Math.hypot(z.re + p.re, z.im - p.im) <= 1e-9 * Math.hypot(p.re, p.im))).toBe(true);
    }
  });

  it('turns dead time of a sampled plant into whole samples of delay, a factor z^−d', () => {
    // 0.5/(z − 0.5) with a delay of 3 samples: 0.5/(z³(z − 0.5))
    const n = normalizePlant({ numerator: [0.5], denominator: [1, -0.5], domain: 'z', sampleTime: 0.1, deadTime: 0.3 });
    expect(n.denominator).toEqual([1, -0.5, 0, 0, 0]);
    expect(n.numerator).toEqual([0.5]);
    expect(n.domain).toBe('z');
    expect(n.sampleTime).toBe(0.1);
  });

  it('discretises 1/(s + 1) with a zero-order hold into (1 − e^−T)/(z − e^−T)', () => {
    // standard zero-order-hold equivalent of a first-order lag (recalled from memory; follows from
    // G(z) = (1 − z⁻¹)·Z{G(s)/s})
    const t = 0.1;
    const n = normalizePlant({ numerator: [1], denominator: [1, 1], discretize: { sampleTime: t } });
    expect(n.domain).toBe('z');
    expect(n.sampleTime).toBe(t);
    expectCoefficients(n.denominator, [1, -Math.exp(-t)], 1e-13);
    expectCoefficients(n.numerator, [1 - Math.exp(-t)], 1e-13);
  });

  it('adds whole samples of dead time to a discretised plant as poles at the origin', () => {
    const n = normalizePlant({ numerator: [1], denominator: [1, 1], discretize: { sampleTime: 0.1 }, deadTime: 0.2 });
    expect(n.denominator).toHaveLength(4);
    expect(n.denominator.slice(2)).toEqual([0, 0]);
  });
});

describe('normalizePlant — repeated roots and cancellations', () => {
  it('multiplies out a fourfold pole into the binomial coefficients of (s + 1)⁴', () => {
    const n = normalizePlant({ poles: Array.from({ length: 4 }, () => ({ re: -1, im: 0 })), zeros: [], gain: 1 });
    expect(n.denominator).toEqual([1, 4, 6, 4, 1]);
  });

  it('warns that a stable pole cancelled by a zero stays in the closed loop at every gain', () => {
    const n = normalizePlant({ zeros: [{ re: -1, im: 0 }], poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }], gain: 1 });
    expect(n.warnings.map((w) => w.code)).toContain('pole-zero-cancellation');
    // the common factor is kept, not divided out
    expect(n.denominator).toEqual([1, 3, 2]);
  });

  it('calls a cancelled unstable pole a hidden unstable mode', () => {
    const n = normalizePlant({ zeros: [{ re: 1, im: 0 }], poles: [{ re: 1, im: 0 }, { re: -2, im: 0 }], gain: 1 });
    expect(n.warnings.map((w) => w.code)).toEqual(['hidden-unstable-mode']);
  });

  it('notices a nearly cancelling pole and zero 1e-8 apart', () => {
    const n = normalizePlant({ zeros: [{ re: -1 - 1e-8, im: 0 }], poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }], gain: 1 });
    expect(n.warnings.map((w) => w.code)).toContain('near-pole-zero-cancellation');
  });

  it('raises no cancellation warning for a pole and zero far apart', () => {
    const n = normalizePlant({ zeros: [{ re: -3, im: 0 }], poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }], gain: 1 });
    expect(n.warnings).toEqual([]);
  });
});

describe('normalizePlant — ill-conditioned and high order', () => {
  it('keeps coefficients spanning many orders of magnitude without rescaling them away', () => {
    // (s + 1e-4)(s + 1e4) = s² + 10000.0001s + 1
    const n = normalizePlant({ poles: [{ re: -1e-4, im: 0 }, { re: -1e4, im: 0 }], zeros: [], gain: 1e6 });
    expectCoefficients(n.denominator, [1, 10000.0001, 1], 1e-15);
    expect(n.numerator).toEqual([1e6]);
  });

  it(`accepts a plant of degree ${MAX_DEGREE} and rejects one of degree ${MAX_DEGREE + 1}`, () => {
    const poles = (count: number) => Array.from({ length: count }, (_, k) => ({ re: -1 - k / count, im: 0 }));
    expect(normalizePlant({ poles: poles(MAX_DEGREE), zeros: [], gain: 1 }).denominator).toHaveLength(MAX_DEGREE + 1);
    expect(pointerOf(() => normalizePlant({ poles: poles(MAX_DEGREE + 1), zeros: [], gain: 1 }))).toBe('/plant/poles');
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [1, ...new Array<number>(MAX_DEGREE + 1).fill(1)] }))).toBe('/plant/denominator');
  });

  it('rejects dead time whose Padé approximant would push the degree past the limit, naming padeOrder', () => {
    const denominator = [1, ...new Array<number>(55).fill(1)]; // degree 55, plus order 10 → 65
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator, deadTime: 1, padeOrder: 10 }))).toBe('/plant/padeOrder');
  });
});

describe('normalizePlant — rejects what is not a plant', () => {
  it('names the field at fault with a JSON pointer under the given prefix', () => {
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [1, NaN, 2] }))).toBe('/plant/denominator/1');
    expect(pointerOf(() => normalizePlant({ numerator: [1, 2, 3], denominator: [1, 2] }))).toBe('/plant/numerator');
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [1, 2] , domain: 'z' }))).toBe('/plant/sampleTime');
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [1, 2] }, '/system'))).toBeUndefined();
    expect(pointerOf(() => normalizePlant({ numerator: [0], denominator: [1, 2] }, '/system'))).toBe('/system/numerator');
  });

  it('refuses a plant that mixes two forms', () => {
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [1, 2], expression: '1/(s+2)' }))).toBe('/plant');
  });

  it('refuses a zero denominator', () => {
    expect(pointerOf(() => normalizePlant({ numerator: [1], denominator: [0, 0] }))).toBe('/plant/denominator');
  });
});
