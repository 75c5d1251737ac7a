import { fromRoots, multiply, normalizePlant, type Plant, type Warning } from '@polewright/locus-core';
import type { Compensator } from './model.js';

/** The parts of a model that make up its loop. */
export interface LoopParts {
  readonly plant: Plant;
  readonly compensator: Compensator | null;
}

/**
 * The plant the engine sees for a model: compensator × plant. Without a compensator it is the stored plant
 * itself (so the engine reports its own dead-time and discretisation notes); with one, the plant is first
 * normalised by the core (Padé, zero-order hold, expression parsing) and the compensator's factors are
 * multiplied in, in the loop's domain. Throws the core's `ValidationError` (pointers under `/plant`).
 * Example: plant 1/(s+1) with compensator { zeros: [−2], poles: [0], gain: 3 } gives 3(s+2)/(s(s+1)).
 */
export function loopPlant(parts: LoopParts): Plant {
  if (parts.compensator === null) return parts.plant;
  const plant = normalizePlant(parts.plant, '/plant');
  const { zeros, poles, gain } = parts.compensator;
  const numerator = multiply(fromRoots(zeros).map((c) => c * gain), plant.numerator);
  const denominator = multiply(fromRoots(poles), plant.denominator);
  return plant.sampleTime === null
    ? { numerator, denominator, domain: plant.domain }
    : { numerator, denominator, domain: plant.domain, sampleTime: plant.sampleTime };
}

/**
 * Notes the core made while normalising the stored plant that the engine cannot repeat once the compensator
 * has been multiplied in (e.g. `dead-time-approximated`); empty without a compensator.
 */
export function plantNotes(parts: LoopParts): Warning[] {
  if (parts.compensator === null) return [];
  return [...normalizePlant(parts.plant, '/plant').warnings];
}
