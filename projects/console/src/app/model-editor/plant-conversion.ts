import { fromRoots, normalizePlant, roots, scaledResidual, ValidationError, type Complex } from '@polewright/locus-core';
import { formatCoefficients, formatNumber, parseCoefficients } from './coefficients';
import type { ComplexEntry, PlantFields, PlantFormKind } from './plant-body';
import { variableOf } from './plant-body';

/** A plant's transfer function N/D as coefficient lists, highest power first (N and D not both scaled). */
interface Rational {
  readonly numerator: number[];
  readonly denominator: number[];
}

/** What switching the plant form gives: the fields in the new form, or why the current form cannot be converted. */
export type Conversion = { readonly fields: PlantFields; readonly message: null } | { readonly fields: null; readonly message: string };

// an imaginary part this small against the root's size is rounding noise of the root finder (e.g. a double
// root found as a ± 1e-9j pair), not a complex pair: common practice, no source
const REAL_TOLERANCE = 1e-7;

// the core's conjugate-pair tolerance (hasCompleteConjugatePairs), relative to the value's size
const PAIR_TOLERANCE = 1e-9;

/** Whether the active form holds nothing yet (switching then discards nothing). */
export function isBlank(fields: PlantFields): boolean {
  if (fields.form === 'expression') return fields.expression.trim() === '';
  if (fields.form === 'coefficients') return fields.numerator.trim() === '' && fields.denominator.trim() === '';
  return fields.zeros.length === 0 && fields.poles.length === 0;
}

/**
 * Rewrites the plant in another form, through the core: an expression is reduced by `normalizePlant`
 * (denominator monic), poles and zeros are multiplied out by `fromRoots`, coefficients are factored by
 * `roots`. Dead time, domain and sampling fields are left as they are. Numbers are rounded to 12
 * significant digits for display, so a round trip can differ in the last digits.
 * Example: convertPlant({ form: 'factored', zeros: [], poles: [{re: 0, im: 0}, {re: -2, im: 0}], gain: 3, … }, 'coefficients')
 * gives numerator '3', denominator '1 2 0'.
 */
export function convertPlant(fields: PlantFields, to: PlantFormKind): Conversion {
  if (fields.form === to) return { fields, message: null };
  let rational: Rational;
  try {
    rational = rationalOf(fields);
  } catch (error) {
    return { fields: null, message: reasonOf(error) };
  }
  const variable = variableOf(fields);
  if (to === 'coefficients') {
    return { fields: { ...fields, form: to, numerator: formatCoefficients(rational.numerator), denominator: formatCoefficients(rational.denominator) }, message: null };
  }
  if (to === 'factored') {
    const lead = rational.numerator[0] / rational.denominator[0];
    return { fields: { ...fields, form: to, zeros: entries(rational.numerator), poles: entries(rational.denominator), gain: Number(lead.toPrecision(12)) }, message: null };
  }
  const expression =
    fields.form === 'factored'
      ? factoredExpression(fields.gain ?? 1, fields.zeros, fields.poles, variable)
      : `(${polynomialExpression(rational.numerator, variable)})/(${polynomialExpression(rational.denominator, variable)})`;
  return { fields: { ...fields, form: to, expression }, message: null };
}

/** N and D of the active form; throws a readable Error (or the core's ValidationError) when it cannot be read. */
function rationalOf(fields: PlantFields): Rational {
  if (fields.form === 'expression') {
    // the sampling period does not change N and D of an expression; the engine only needs one for a z-plant
    const probe = variableOf(fields) === 'z' ? { expression: fields.expression, domain: 'z', sampleTime: 1 } : { expression: fields.expression };
    const normalized = normalizePlant(probe, '/plant');
    return { numerator: [...normalized.numerator], denominator: [...normalized.denominator] };
  }
  if (fields.form === 'coefficients') {
    const numerator = parseCoefficients(fields.numerator);
    if (numerator.values === null) throw new Error(`the numerator cannot be read: ${numerator.message}`);
    const denominator = parseCoefficients(fields.denominator);
    if (denominator.values === null) throw new Error(`the denominator cannot be read: ${denominator.message}`);
    const n = trimLeading(numerator.values);
    const d = trimLeading(denominator.values);
    if (n.length === 0 || d.length === 0) throw new Error('a polynomial is zero');
    return { numerator: n, denominator: d };
  }
  // checks conjugate pairs and the gain the way a save would, before multiplying out
  normalizePlant({ zeros: fields.zeros.map(complexOf), poles: fields.poles.map(complexOf), gain: fields.gain }, '/plant');
  return { numerator: fromRoots(fields.zeros.map(complexOf)).map((c) => c * (fields.gain as number)), denominator: fromRoots(fields.poles.map(complexOf)) };
}

function complexOf(entry: ComplexEntry): Complex {
  if (entry.re === null) throw new Error('a pole or zero has no real part');
  return { re: entry.re, im: entry.im ?? 0 };
}

function trimLeading(values: readonly number[]): number[] {
  const start = values.findIndex((v) => v !== 0);
  return start < 0 ? [] : values.slice(start);
}

/** The roots of a polynomial as the editor lists them: tidy numbers, real ones first (right to left), then pairs. */
function entries(polynomial: readonly number[]): ComplexEntry[] {
  const tidy = roots([...polynomial]).map((root) => tidyRoot(polynomial, root));
  return tidy.sort((a, b) => Number(a.im !== 0) - Number(b.im !== 0) || b.re - a.re || b.im - a.im);
}

/**
 * A root written with as few significant digits as still make it a root to working precision (scaled
 * residual at the backward-error level), else with 12. A double root found as −0.599999997 and −0.600000003
 * (the accuracy a multiple root allows) is written −0.6 twice; an irrational root keeps 12 digits.
 */
function tidyRoot(polynomial: readonly number[], root: Complex): { re: number; im: number } {
  const real = Math.abs(root.im) <= REAL_TOLERANCE * Math.max(1, Math.hypot(root.re, root.im));
  const limit = 8 * polynomial.length * Number.EPSILON;
  for (let digits = 1; digits <= 12; digits++) {
    const candidate = { re: round(root.re, digits), im: real ? 0 : round(root.im, digits) };
    if (digits === 12 || scaledResidual([...polynomial], candidate) <= limit) return candidate;
  }
  return { re: root.re, im: root.im };
}

function round(value: number, digits: number): number {
  const rounded = Number(value.toPrecision(digits));
  return rounded === 0 ? 0 : rounded;
}

/** A polynomial as expression text. Example: polynomialExpression([1, -2.5, 0], 's') = 's^2-2.5*s'. */
function polynomialExpression(values: readonly number[], variable: string): string {
  const degree = values.length - 1;
  let text = '';
  values.forEach((c, i) => {
    if (c === 0 && values.length > 1) return;
    const power = degree - i;
    const magnitude = formatNumber(Math.abs(c));
    const monomial = power === 0 ? magnitude : `${magnitude === '1' ? '' : `${magnitude}*`}${variable}${power > 1 ? `^${power}` : ''}`;
    text += (c < 0 ? '-' : text === '' ? '' : '+') + monomial;
  });
  return text || '0';
}

/** Poles, zeros and gain as a product expression: real roots as (s+a), conjugate pairs as (s^2+b*s+c). */
function factoredExpression(gain: number, zeros: readonly ComplexEntry[], poles: readonly ComplexEntry[], variable: string): string {
  const numerator = factors(zeros, variable);
  const denominator = factors(poles, variable);
  const top = [...(gain === 1 && numerator.length > 0 ? [] : [formatNumber(gain)]), ...numerator].join('*');
  if (denominator.length === 0) return top;
  return `${top}/(${denominator.join('*')})`;
}

function factors(values: readonly ComplexEntry[], variable: string): string[] {
  const out: string[] = [];
  const used = new Set<number>();
  values.forEach((v, i) => {
    if (used.has(i)) return;
    used.add(i);
    const re = v.re ?? 0;
    const im = v.im ?? 0;
    if (im === 0) {
      out.push(re === 0 ? variable : `(${variable}${re < 0 ? '+' : '-'}${formatNumber(Math.abs(re))})`);
      return;
    }
    // its conjugate (checked by the core before) joins it in one real quadratic factor
    const scale = PAIR_TOLERANCE * Math.max(1, Math.hypot(re, im));
    const partner = values.findIndex((w, j) => !used.has(j) && Math.abs((w.re ?? 0) - re) <= scale && Math.abs((w.im ?? 0) + im) <= scale);
    if (partner >= 0) used.add(partner);
    out.push(`(${polynomialExpression([1, -2 * re, re * re + im * im], variable)})`);
  });
  return out;
}

function reasonOf(error: unknown): string {
  if (error instanceof ValidationError) return error.issues.map((i) => `${fieldName(i.pointer)} ${i.detail}`).join('; ');
  return error instanceof Error ? error.message : String(error);
}

function fieldName(pointer: string): string {
  const field = pointer.split('/')[2] ?? 'plant';
  return { expression: 'the expression', zeros: 'the zeros', poles: 'the poles', gain: 'the gain' }[field] ?? field;
}
