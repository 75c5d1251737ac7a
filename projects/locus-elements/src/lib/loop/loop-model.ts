import { fromRoots, multiply, normalizePlant, ValidationError, type Complex, type FieldIssue, type NormalizedPlant, type Plant, type Warning } from '@polewright/locus-core';

/** A compensator C(x) = gain · Π(x − zᵢ) / Π(x − pᵢ) in the loop's working domain (after normalisation). */
export interface Compensator {
  readonly zeros: readonly Complex[];
  readonly poles: readonly Complex[];
  readonly gain: number;
}

/** What an element works on: the plant and an optional compensator in series with it. */
export interface LoopModel {
  readonly plant: Plant;
  readonly compensator: Compensator | null;
  /** Display name, when the model came from the API or carried one. */
  readonly name?: string;
}

/**
 * Reads the `model` attribute: a JSON plant (`{"expression": …}`, coefficients or factored form), a JSON
 * `{plant, compensator}` object (a Model resource of the API qualifies), or a bare expression string.
 * Throws an Error that says what is wrong (a `ValidationError` with field pointers for a bad plant).
 * Example: parseModelInput('1/(s*(s+2))') = { plant: { expression: '1/(s*(s+2))' }, compensator: null }.
 */
export function parseModelInput(text: string): LoopModel {
  const trimmed = text.trim();
  if (trimmed === '') throw new Error('The model is empty: give a plant as JSON or an expression such as 1/(s*(s+2)).');
  if (!trimmed.startsWith('{')) return readModel({ expression: trimmed });
  let value: unknown;
  try {
    value = JSON.parse(trimmed);
  } catch (error) {
    throw new Error(`The model is not valid JSON (${(error as Error).message}).`);
  }
  return readModel(value);
}

/**
 * Turns a value set as a property (an object, or text as for the attribute) into a checked LoopModel.
 * The plant is checked by the core's `normalizePlant`; the compensator here. Throws like `parseModelInput`.
 */
export function readModel(value: unknown): LoopModel {
  if (typeof value === 'string') return parseModelInput(value);
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new Error('The model must be a plant object, a {plant, compensator} object or an expression string.');
  }
  const record = value as Record<string, unknown>;
  const hasPlant = 'plant' in record;
  const plant = (hasPlant ? record['plant'] : record) as Plant;
  normalizedOf(plant, hasPlant ? '/plant' : '');
  const compensator = hasPlant ? readCompensator(record['compensator']) : null;
  const name = typeof record['name'] === 'string' ? record['name'] : undefined;
  return name === undefined ? { plant, compensator } : { plant, compensator, name };
}

/**
 * The plant the engine sees: compensator × plant. Without a compensator it is the plant as given (so the
 * core's own notes, such as the Padé one, still appear); with one, the plant is normalised by the core and
 * multiplied by the compensator in its working domain — the same steps, in the same order, as the server's
 * `loopPlant`, so that browser and API compute the same loop. Throws `ValidationError` for an improper loop.
 * Example: loopPlant({ plant: { expression: '1/(s*(s+2))' }, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } })
 * = { numerator: [4, 12], denominator: [1, 11, 18, 0], domain: 's' }.
 */
export function loopPlant(model: LoopModel): Plant {
  const c = model.compensator;
  if (c === null) return model.plant;
  const normalized = normalizedOf(model.plant, '/plant');
  const numerator = multiply(fromRoots(c.zeros).map((a) => a * c.gain), normalized.numerator);
  const denominator = multiply(fromRoots(c.poles), normalized.denominator);
  if (numerator.length > denominator.length) {
    throw ValidationError.at(
      '/compensator/zeros',
      `makes the loop improper: ${numerator.length - 1} zeros against ${denominator.length - 1} poles (a physical loop cannot have more zeros than poles)`,
    );
  }
  return normalized.sampleTime === null
    ? { numerator, denominator, domain: normalized.domain }
    : { numerator, denominator, domain: normalized.domain, sampleTime: normalized.sampleTime };
}

/**
 * Notes the core made while normalising the plant that the engine cannot repeat once the compensator is
 * multiplied in (e.g. `dead-time-approximated`); empty without a compensator.
 */
export function plantNotes(model: LoopModel): Warning[] {
  if (model.compensator === null) return [];
  return [...normalizedOf(model.plant, '/plant').warnings];
}

// while a compensator is dragged the plant object stays the same: normalise it once, not on every frame
const normalizedPlants = new WeakMap<object, NormalizedPlant>();

function normalizedOf(plant: Plant, pointer: string): NormalizedPlant {
  const known = typeof plant === 'object' && plant !== null ? normalizedPlants.get(plant) : undefined;
  if (known) return known;
  const normalized = normalizePlant(plant, pointer);
  normalizedPlants.set(plant, normalized);
  return normalized;
}

function readCompensator(value: unknown): Compensator | null {
  if (value === undefined || value === null) return null;
  if (typeof value !== 'object' || Array.isArray(value)) throw ValidationError.at('/compensator', 'must be an object with zeros, poles and gain, or null');
  const record = value as Record<string, unknown>;
  const issues: FieldIssue[] = [];
  const zeros = readRoots(record['zeros'] ?? [], '/compensator/zeros', issues);
  const poles = readRoots(record['poles'] ?? [], '/compensator/poles', issues);
  const gain = record['gain'] ?? 1;
  if (typeof gain !== 'number' || !Number.isFinite(gain) || gain === 0) issues.push({ pointer: '/compensator/gain', detail: 'must be a finite, non-zero number' });
  if (issues.length) throw new ValidationError(issues);
  return { zeros, poles, gain: gain as number };
}

function readRoots(value: unknown, pointer: string, issues: FieldIssue[]): Complex[] {
  if (!Array.isArray(value)) {
    issues.push({ pointer, detail: 'must be a list of {re, im} values' });
    return [];
  }
  const out: Complex[] = [];
  value.forEach((v, i) => {
    const re = (v as Record<string, unknown> | null)?.['re'];
    const im = (v as Record<string, unknown> | null)?.['im'] ?? 0;
    if (typeof re !== 'number' || typeof im !== 'number' || !Number.isFinite(re) || !Number.isFinite(im)) {
      issues.push({ pointer: `${pointer}/${i}`, detail: 'must be {re, im} with finite numbers' });
    } else out.push({ re, im });
  });
  if (issues.length === 0 && !pairsComplete(out)) {
    issues.push({ pointer, detail: 'has a complex value without its conjugate; complex values of a real compensator come in pairs a ± bj' });
  }
  return out;
}

function pairsComplete(values: readonly Complex[]): boolean {
  const open = values.filter((v) => v.im !== 0);
  const used = new Array<boolean>(open.length).fill(false);
  for (let i = 0; i < open.length; i++) {
    if (used[i]) continue;
    const tol = 1e-9 * Math.max(1, Math.hypot(open[i].re, open[i].im));
    const j = open.findIndex((w, k) => !used[k] && k !== i && Math.abs(w.re - open[i].re) <= tol && Math.abs(w.im + open[i].im) <= tol);
    if (j < 0) return false;
    used[i] = used[j] = true;
  }
  return true;
}
