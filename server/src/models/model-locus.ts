import type { DataSource } from 'typeorm';
import type { AppContext } from '../context.js';
import { NotFoundError } from '../http/errors.js';
import { compute } from '../compute/compute.service.js';
import { type CachedLocus, LocusCache } from './locus-cache.js';
import { loopHeaderCacheOf } from './loop-header-cache.js';
export { loopLocus } from './loop-locus.js';
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

/** A served locus: the JSON bytes, their ETag and the content hash they were computed from. */
export interface ServedLocus extends CachedLocus {
  readonly contentHash: string;
  readonly revision: number;
  /** Whether the answer came from the cache. */
  readonly cached: boolean;
}

// computations in flight per cache by content hash: concurrent misses of one loop share one engine run
const inFlight = new WeakMap<LocusCache, Map<string, Promise<CachedLocus>>>();

/**
 * The locus of a model's current revision, from the in-memory cache keyed by the SHA-256 of the loop
 * content when present (its header: one query, or none within 2 s of the last), else computed by the core in the compute
 * pool and cached. Throws `NotFoundError` for unknown or deleted models.
 */
export async function modelLocus(context: AppContext, id: string): Promise<ServedLocus> {
  const header = await loopHeader(context, id);
  if (!header || header.deletedAt !== null) throw new NotFoundError(`Model ${id}`);
  const served = { contentHash: header.contentHash, revision: header.revision };
  const cache = locusCacheOf(context);
  const hit = cache.get(header.contentHash);
  if (hit !== undefined) return { ...hit, ...served, cached: true };
  let pending = inFlight.get(cache);
  if (!pending) inFlight.set(cache, (pending = new Map()));
  let computing = pending.get(header.contentHash);
  if (!computing) {
    computing = computeEntry(context, id, header.revision, header.contentHash).finally(() => pending.delete(header.contentHash));
    pending.set(header.contentHash, computing);
  }
  return { ...(await computing), ...served, cached: false };
}

/** The model's loop header, from the short-lived memo (loop-header-cache.ts) or one query. */
async function loopHeader(context: AppContext, id: string): Promise<repository.LoopHeader | null> {
  const memo = loopHeaderCacheOf(context.dataSource);
  const known = memo.get(id);
  if (known) return known;
  const generation = memo.generation;
  const header = await repository.findLoopHeader(context.dataSource, id);
  if (header) memo.set(id, header, generation);
  return header;
}

async function computeEntry(context: AppContext, id: string, revisionNumber: number, contentHash: string): Promise<CachedLocus> {
  const revision = await repository.findRevision(context.dataSource, id, revisionNumber);
  if (!revision) throw new NotFoundError(`Model ${id}`);
  const entry: CachedLocus = { body: await compute(context, 'loop-locus', { plant: revision.plant, compensator: revision.compensator }), etag: `"${contentHash}"` };
  locusCacheOf(context).set(contentHash, entry);
  return entry;
}
