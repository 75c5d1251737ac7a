import { describe, expect, it } from 'vitest';
import { exponential, heldStep } from './zero-order-hold';

describe('exponential', () => {
  it('matches the closed form of a rotation generator, e^{[[0, −w], [w, 0]]} = [[cos w, −sin w], [sin w, cos w]]', () => {
    // a standard identity; checked at an angle large enough that scaling and squaring is needed
    const w = 37.5;
    const e = exponential([[0, -w], [w, 0]]);
    expect(e[0][0]).toBeCloseTo(Math.cos(w), 11);
    expect(e[0][1]).toBeCloseTo(-Math.sin(w), 11);
    expect(e[1][0]).toBeCloseTo(Math.sin(w), 11);
    expect(e[1][1]).toBeCloseTo(Math.cos(w), 11);
  });

  it('handles a stiff diagonal matrix whose norm is far above one', () => {
    const e = exponential([[-800, 0], [0, -0.5]]);
    // e^{−800} is below the smallest double; ten squarings cost a few ulps on the slow mode
    expect(e[0][0]).toBeGreaterThanOrEqual(0);
    expect(e[0][0]).toBeLessThan(1e-300);
    expect(Math.abs(e[1][1] - Math.exp(-0.5))).toBeLessThan(1e-12);
    expect(e[0][1]).toBe(0);
  });
});

describe('heldStep', () => {
  it('gives Φ = e^{−ah} and Γ = (1 − e^{−ah})/a for ẋ = −a·x + u (exact ZOH of a first-order lag)', () => {
    const a = 3;
    const h = 0.2;
    const { phi, gamma } = heldStep({ a: [[-a]], b: [1], c: [1], d: 0 }, h);
    expect(phi[0][0]).toBeCloseTo(Math.exp(-a * h), 14);
    expect(gamma[0]).toBeCloseTo((1 - Math.exp(-a * h)) / a, 14);
  });
});
