import { locus, type LocusResult, type Warning } from '@polewright/locus-core';
import type { DataSource } from 'typeorm';
import type { AppContext } from '../context.js';
import { NotFoundError } from '../http/errors.js';
import { LocusCache } from './locus-cache.js';
import { loopPlant, plantNotes, type LoopParts } from './loop-plant.js';
import * as repository from './models.repository.js';

const caches = new WeakMap<DataSource, LocusCache>();

/** The locus cache of this server's database (one per data source, created on first use). */
export function locusCacheOf(context: AppContext): LocusCache {
  let cache = caches.get(context.dataSource);
  if (!cache) {
    cache = new LocusCache();
    caches.set(context.dataSource, cache);
  }
  return cache;
}

/**
 * The engine's locus of a loop (compensator × plant), with the notes the core made while normalising the
 * stored plant added when the compensator hid them from the engine.
 */
export function loopLocus(parts: LoopParts): LocusResult {
  const result = locus({ plant: loopPlant(parts) });
  const seen = new Set(result.warnings.map((w) => w.code));
  const notes: Warning[] = plantNotes(parts).filter((w) => !seen.has(w.code));
  return notes.length ? { ...result, warnings: [...notes, ...result.warnings] } : result;
}

/** A served locus: the serialised result and the content hash it was computed from. */
export interface ServedLocus {
  readonly text: string;
  readonly contentHash: string;
  readonly revision: number;
  /** Whether the text came from the cache. */
  readonly cached: boolean;
}

/**
 * The locus of a model's current revision, from the in-memory cache keyed by the SHA-256 of the loop
 * content when present, else computed by the core and cached. Throws `NotFoundError` for unknown or
 * deleted models.
 */
export async function modelLocus(context: AppContext, id: string): Promise<ServedLocus> {
  const header = await repository.findLoopHeader(context.dataSource, id);
  if (!header || header.deletedAt !== null) throw new NotFoundError(`Model ${id}`);
  const cache = locusCacheOf(context);
  const hit = cache.get(header.contentHash);
  if (hit !== undefined) return { text: hit, contentHash: header.contentHash, revision: header.revision, cached: true };
  const revision = await repository.findRevision(context.dataSource, id, header.revision);
  if (!revision) throw new NotFoundError(`Model ${id}`);
  const text = JSON.stringify(loopLocus(revision));
  cache.set(header.contentHash, text);
  return { text, contentHash: header.contentHash, revision: header.revision, cached: false };
}
