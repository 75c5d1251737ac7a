/*
 * A short-lived, per-process memo of each model's loop header (current revision, deleted flag, content
 * hash): the one query a cached `GET /models/{id}/locus` would otherwise make. The repository's write
 * functions (`advanceModel`, `setDeleted`) drop the id at once after their UPDATE, and a generation counter
 * keeps a read that started before such a write from storing its stale header; the TTL only bounds what
 * another process writing the same database could leave stale.
 */
import type { DataSource } from 'typeorm';
import type { LoopHeader } from './models.repository.js';

/** How long a header is reused without a query. */
export const LOOP_HEADER_TTL_MS = 2_000;
/** Upper bound of remembered headers (the oldest go first). */
export const LOOP_HEADER_MAX_ENTRIES = 5_000;

interface Memo {
  readonly header: LoopHeader;
  readonly staleAt: number;
}

/** The headers of one data source. */
export class LoopHeaderCache {
  private readonly entries = new Map<string, Memo>();
  private currentGeneration = 0;

  /** Bumped by every `forget`; take it before the query and hand it to `set`. */
  get generation(): number {
    return this.currentGeneration;
  }

  /** The header of `id` unless it is missing or stale. */
  get(id: string, nowMs = Date.now()): LoopHeader | undefined {
    const memo = this.entries.get(id);
    if (!memo) return undefined;
    if (memo.staleAt <= nowMs) {
      this.entries.delete(id);
      return undefined;
    }
    return memo.header;
  }

  /** Remembers a header read at `generation` (dropped when a write came in between). */
  set(id: string, header: LoopHeader, generation: number, nowMs = Date.now()): void {
    if (generation !== this.currentGeneration) return;
    this.entries.delete(id);
    this.entries.set(id, { header, staleAt: nowMs + LOOP_HEADER_TTL_MS });
    while (this.entries.size > LOOP_HEADER_MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value as string);
  }

  /** Forgets one model's header (after a write to it). */
  forget(id: string): void {
    this.currentGeneration++;
    this.entries.delete(id);
  }
}

const caches = new WeakMap<DataSource, LoopHeaderCache>();

/** The header cache of a data source (created on first use). */
export function loopHeaderCacheOf(dataSource: DataSource): LoopHeaderCache {
  let cache = caches.get(dataSource);
  if (!cache) {
    cache = new LoopHeaderCache();
    caches.set(dataSource, cache);
  }
  return cache;
}
