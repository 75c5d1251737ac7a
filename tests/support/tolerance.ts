import { expect } from 'vitest';

/**
 * The one float comparison of the cross-project tests.
 *
 * `actual` passes when |actual − expected| ≤ max(abs, rel·|expected|): the reference value is the
 * yardstick, so a relative tolerance means "relative to what it should be". Special cases, on purpose:
 * - expected 0 with abs = 0 demands an exact 0 (a relative tolerance of zero is zero), so give `abs`
 *   whenever the reference can be 0;
 * - NaN passes only against NaN (so a test can demand "undefined here"); NaN never passes a finite value;
 * - ±Infinity passes only against the same infinity.
 */
export function isWithin(actual: number, expected: number, rel: number, abs = 0): boolean {
  if (Number.isNaN(expected)) return Number.isNaN(actual);
  if (Number.isNaN(actual)) return false;
  if (!Number.isFinite(expected) || !Number.isFinite(actual)) return actual === expected;
  return Math.abs(actual - expected) <= Math.max(abs, rel * Math.abs(expected));
}

/** Asserts `isWithin(actual, expected, rel, abs)` with a message that shows both values and the gap. */
export function expectClose(actual: number, expected: number, rel: number, abs = 0, label = ''): void {
  const ok = isWithin(actual, expected, rel, abs);
  const message = `${label ? label + ': ' : ''}expected ${actual} to be within rel ${rel}${abs ? ` / abs ${abs}` : ''} of ${expected} (gap ${Math.abs(actual - expected)})`;
  expect(ok, message).toBe(true);
}

/** Complex version: the distance |actual − expected| against max(abs, rel·|expected|). */
export function expectComplexClose(
  actual: { re: number; im: number },
  expected: { re: number; im: number },
  rel: number,
  abs = 0,
  label = '',
): void {
  const gap = Math.hypot(actual.re - expected.re, actual.im - expected.im);
  const ok = Number.isFinite(gap) && gap <= Math.max(abs, rel * Math.hypot(expected.re, expected.im));
  const message = `${label ? label + ': ' : ''}expected ${actual.re}${actual.im >= 0 ? '+' : ''}${actual.im}j to be within rel ${rel}${abs ? ` / abs ${abs}` : ''} of ${expected.re}${expected.im >= 0 ? '+' : ''}${expected.im}j (gap ${gap})`;
  expect(ok, message).toBe(true);
}
