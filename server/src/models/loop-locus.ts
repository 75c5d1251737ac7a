import { locus, loopPlant, plantNotes, type LocusResult, type LoopParts, type Warning } from '@polewright/locus-core';

/**
 * The engine's locus of a loop (compensator × plant), with the notes the core made while normalising the
 * stored plant added when the compensator hid them from the engine. Pure: runs in the compute workers.
 */
export function loopLocus(parts: LoopParts): LocusResult {
  const result = locus({ plant: loopPlant(parts) });
  const seen = new Set(result.warnings.map((w) => w.code));
  const notes: Warning[] = plantNotes(parts).filter((w) => !seen.has(w.code));
  return notes.length ? { ...result, warnings: [...notes, ...result.warnings] } : result;
}
