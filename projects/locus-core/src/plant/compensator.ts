import type { Complex } from '../complex/complex';
import { firstUnpaired } from '../complex/conjugate-pairs';
import { ValidationError, type FieldIssue } from '../errors';
import { fromRoots } from '../polynomial/from-roots';
import { multiply } from '../polynomial/polynomial';
import type { NormalizedPlant, Plant, Warning } from '../types/plant';
import { normalizePlant } from './normalize';

/** A compensator C(x) = gain · Π(x − zᵢ) / Π(x − pᵢ) in the loop's working domain (after normalisation). */
export interface Compensator {
  readonly zeros: readonly Complex[];
  readonly poles: readonly Complex[];
  readonly gain: number;
}

/** A plant with an optional compensator in series: the loop the engine is asked about. */
export interface LoopParts {
  readonly plant: Plant;
  readonly compensator: Compensator | null;
}

/** Most zeros or poles a compensator may list (the degree limit of the whole loop applies as well). */
export const MAX_COMPENSATOR_ROOTS = 20;

/**
 * Checks a compensator `{ zeros, poles, gain }` (or null/undefined → null) and returns it in plain form.
 * Complex values must come in conjugate pairs, since the loop is a real transfer function.
 * Throws `ValidationError` listing every field at fault under `pointer`.
 * Example: readCompensator({ zeros: [{ re: -2 }], poles: [] }) = { zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 }.
 */
export function readCompensator(value: unknown, pointer = '/compensator'): Compensator | null {
  if (value === null || value === undefined) return null;
  if (typeof value !== 'object' || Array.isArray(value)) {
    throw ValidationError.at(pointer, 'must be null or an object { "zeros": [...], "poles": [...], "gain": number }');
  }
  const record = value as Record<string, unknown>;
  const issues: FieldIssue[] = [];
  const zeros = readRoots(record['zeros'] ?? [], `${pointer}/zeros`, issues);
  const poles = readRoots(record['poles'] ?? [], `${pointer}/poles`, issues);
  const gain = record['gain'] ?? 1;
  if (typeof gain !== 'number' || !Number.isFinite(gain) || gain === 0) issues.push({ pointer: `${pointer}/gain`, detail: 'must be a finite, non-zero number' });
  if (issues.length) throw new ValidationError(issues);
  return { zeros, poles, gain: gain as number };
}

/**
 * The plant the engine sees for a loop: compensator × plant. Without a compensator it is the plant as given
 * (so the engine reports its own dead-time and discretisation notes); with one, the plant is normalised
 * (Padé, zero-order hold, expression parsing) and the compensator's factors are multiplied in, in the loop's
 * working domain. `normalized` may pass the plant's normalised form when the caller already has it (the
 * elements keep it while a compensator is dragged). Throws `ValidationError`: plant faults under `/plant`,
 * a compensator that leaves more zeros than poles at `/compensator/zeros`.
 * Example: plant 1/(s(s+2)) with { zeros: [−3], poles: [−9], gain: 4 } gives 4(s+3)/(s(s+2)(s+9)),
 * i.e. { numerator: [4, 12], denominator: [1, 11, 18, 0], domain: 's' }.
 */
export function loopPlant(parts: LoopParts, normalized?: NormalizedPlant): Plant {
  const c = parts.compensator;
  if (c === null) return parts.plant;
  const plant = normalized ?? normalizePlant(parts.plant, '/plant');
  const numerator = multiply(fromRoots(c.zeros).map((a) => a * c.gain), plant.numerator);
  const denominator = multiply(fromRoots(c.poles), plant.denominator);
  if (numerator.length > denominator.length) {
    throw ValidationError.at(
      '/compensator/zeros',
      `makes the loop improper: ${numerator.length - 1} zeros against ${denominator.length - 1} poles (a physical loop cannot have more zeros than poles)`,
    );
  }
  return plant.sampleTime === null
    ? { numerator, denominator, domain: plant.domain }
    : { numerator, denominator, domain: plant.domain, sampleTime: plant.sampleTime };
}

/**
 * Notes made while normalising the plant that the engine cannot repeat once the compensator has been
 * multiplied in (e.g. `dead-time-approximated`); empty without a compensator.
 */
export function plantNotes(parts: LoopParts, normalized?: NormalizedPlant): Warning[] {
  if (parts.compensator === null) return [];
  return [...(normalized ?? normalizePlant(parts.plant, '/plant')).warnings];
}

function readRoots(value: unknown, pointer: string, issues: FieldIssue[]): Complex[] {
  if (!Array.isArray(value)) {
    issues.push({ pointer, detail: 'must be an array of complex numbers { "re": number, "im": number }' });
    return [];
  }
  if (value.length > MAX_COMPENSATOR_ROOTS) {
    issues.push({ pointer, detail: `lists ${value.length} values; at most ${MAX_COMPENSATOR_ROOTS} are accepted` });
    return [];
  }
  const out: Complex[] = [];
  const before = issues.length;
  value.forEach((v: unknown, i) => {
    const item = typeof v === 'object' && v !== null ? (v as Record<string, unknown>) : null;
    const re = item?.['re'];
    const im = item?.['im'] ?? 0;
    if (typeof re !== 'number' || !Number.isFinite(re) || typeof im !== 'number' || !Number.isFinite(im)) {
      issues.push({ pointer: `${pointer}/${i}`, detail: 'must be { "re": number, "im": number } with finite numbers' });
    } else out.push({ re, im });
  });
  if (issues.length > before) return out;
  const unpaired = firstUnpaired(out);
  if (unpaired >= 0) issues.push({ pointer: `${pointer}/${unpaired}`, detail: 'is complex without its conjugate; complex values of a real compensator come in pairs a ± bj' });
  return out;
}
