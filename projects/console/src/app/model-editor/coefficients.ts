import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** Most coefficients one list may hold (the contract's `maxItems`). */
export const MAX_COEFFICIENTS = 125;

/** A coefficient list typed as text, read: the numbers, or why they cannot be read. */
export type CoefficientReading = { readonly values: number[]; readonly message: null } | { readonly values: null; readonly message: string };

// a plain decimal number: sign, digits with an optional point, optional exponent (no hex, no Infinity)
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i;

/**
 * Reads a coefficient list typed as text: numbers separated by spaces, commas or semicolons, highest power
 * first, optionally in square brackets (as pasted from JSON or a script). Decimals take a point.
 * Example: parseCoefficients('1, 0.9 0') = { values: [1, 0.9, 0], message: null }.
 */
export function parseCoefficients(text: string): CoefficientReading {
  const inner = text.trim().replace(/^\[([\s\S]*)\]$/, '$1').trim();
  if (inner === '') return failure('Give at least one coefficient, highest power first, e.g. "1 0.9 0".');
  const tokens = inner.split(/[\s,;]+/).filter((token) => token !== '');
  if (tokens.length > MAX_COEFFICIENTS) return failure(`Lists ${tokens.length} coefficients; at most ${MAX_COEFFICIENTS}.`);
  const values: number[] = [];
  for (const [index, token] of tokens.entries()) {
    if (!NUMBER.test(token)) {
      return failure(`"${token}" (coefficient ${index + 1}) is not a number. Separate the numbers with spaces or commas and write decimals with a point.`);
    }
    const value = Number(token);
    if (!Number.isFinite(value)) return failure(`"${token}" (coefficient ${index + 1}) is too large for double precision.`);
    values.push(value);
  }
  return { values, message: null };
}

/** Validator of a coefficient list field: error `coefficients` with the reason as its `message`. */
export function coefficientList(control: AbstractControl): ValidationErrors | null {
  const reading = parseCoefficients(String(control.value ?? ''));
  return reading.message === null ? null : { coefficients: { message: reading.message } };
}

/** A number as the editor writes it: at most 12 significant digits, so rounding noise of a conversion does not show. */
export function formatNumber(value: number): string {
  if (value === 0) return '0';
  return String(Number(value.toPrecision(12)));
}

/** A coefficient list as text, the way the field reads it back. Example: formatCoefficients([1, 0.9, 0]) = '1 0.9 0'. */
export function formatCoefficients(values: readonly number[]): string {
  return values.map(formatNumber).join(' ');
}

/**
 * The polynomial a coefficient list stands for, written out (leading zeros dropped), so that the engineer
 * sees which power each number belongs to. Example: polynomialText([2, 0, -1.5], 's') = '2s² − 1.5'.
 */
export function polynomialText(values: readonly number[], variable: string): string {
  const start = values.findIndex((v) => v !== 0);
  if (start < 0) return '0';
  const degree = values.length - 1;
  const terms: string[] = [];
  for (let i = start; i < values.length; i++) {
    const c = values[i];
    if (c === 0) continue;
    const power = degree - i;
    const magnitude = Math.abs(c);
    const factor = power === 0 ? formatNumber(magnitude) : magnitude === 1 ? '' : formatNumber(magnitude);
    const term = factor + (power === 0 ? '' : power === 1 ? variable : `${variable}${superscript(power)}`);
    terms.push(terms.length === 0 ? (c < 0 ? `−${term}` : term) : `${c < 0 ? '−' : '+'} ${term}`);
  }
  return terms.join(' ');
}

const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

function superscript(power: number): string {
  return [...String(power)].map((d) => SUPERSCRIPTS[Number(d)]).join('');
}

function failure(message: string): CoefficientReading {
  return { values: null, message };
}
