import {
  loopPlant as coreLoopPlant,
  normalizePlant,
  plantNotes as corePlantNotes,
  readCompensator,
  type Compensator,
  type NormalizedPlant,
  type Plant,
  type Warning,
} from '@polewright/locus-core';

export type { Compensator } from '@polewright/locus-core';

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
 * The plant is checked by the core's `normalizePlant`, the compensator by its `readCompensator`. Throws like `parseModelInput`.
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
  const compensator = hasPlant ? readCompensator(record['compensator'], '/compensator') : null;
  const name = typeof record['name'] === 'string' ? record['name'] : undefined;
  return name === undefined ? { plant, compensator } : { plant, compensator, name };
}

/**
 * The plant the engine sees: compensator × plant — the core's `loopPlant`, the very function the server uses,
 * with the plant's normalised form kept between calls (while a compensator is dragged the plant object stays
 * the same, so it is normalised once, not on every frame). Throws `ValidationError` for an improper loop.
 * Example: loopPlant({ plant: { expression: '1/(s*(s+2))' }, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } })
 * = { numerator: [4, 12], denominator: [1, 11, 18, 0], domain: 's' }.
 */
export function loopPlant(model: LoopModel): Plant {
  return model.compensator === null ? model.plant : coreLoopPlant(model, normalizedOf(model.plant, '/plant'));
}

/** The core's `plantNotes` with the same kept normalisation: notes the multiplied loop can no longer produce. */
export function plantNotes(model: LoopModel): Warning[] {
  return model.compensator === null ? [] : corePlantNotes(model, normalizedOf(model.plant, '/plant'));
}

const normalizedPlants = new WeakMap<object, NormalizedPlant>();

function normalizedOf(plant: Plant, pointer: string): NormalizedPlant {
  const known = typeof plant === 'object' && plant !== null ? normalizedPlants.get(plant) : undefined;
  if (known) return known;
  const normalized = normalizePlant(plant, pointer);
  normalizedPlants.set(plant, normalized);
  return normalized;
}
