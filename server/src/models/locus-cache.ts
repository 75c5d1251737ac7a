/**
 * In-memory LRU of serialised locus results keyed by the SHA-256 of the loop content, bounded by the
 * total size of the stored bytes. In memory on purpose: a result belongs to the engine build that computed
 * it, so it must not outlive the process (a persistent table would serve stale numbers after an upgrade).
 * Entries keep the UTF-8 bytes ready to send and their ETag, so a hit costs no serialisation or encoding.
 */

/** A cached answer: the JSON body as bytes and its strong ETag. */
export interface CachedLocus {
  readonly body: Buffer;
  readonly etag: string;
}

/** Default bound of the cache: 16 MiB of JSON (a degree-20 locus is a few hundred KB). */
export const LOCUS_CACHE_MAX_BYTES = 16 * 1024 * 1024;

/** The LRU itself (one per data source, see model-locus.ts). */
export class LocusCache {
  private readonly entries = new Map<string, CachedLocus>();
  private bytes = 0;

  /** @param maxBytes upper bound of the summed byte length of the cached bodies. */
  constructor(private readonly maxBytes = LOCUS_CACHE_MAX_BYTES) {}

  /** The cached answer for `hash`, marking it most recently used; undefined on a miss. */
  get(hash: string): CachedLocus | undefined {
    const entry = this.entries.get(hash);
    if (entry === undefined) return undefined;
    this.entries.delete(hash);
    this.entries.set(hash, entry);
    return entry;
  }

  /** Stores `entry` under `hash`, evicting the least recently used entries beyond the size bound. */
  set(hash: string, entry: CachedLocus): void {
    const old = this.entries.get(hash);
    if (old !== undefined) {
      this.bytes -= old.body.length;
      this.entries.delete(hash);
    }
    if (entry.body.length > this.maxBytes) return;
    this.entries.set(hash, entry);
    this.bytes += entry.body.length;
    for (const [key, value] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(key);
      this.bytes -= value.body.length;
    }
  }

  /** Number of cached results. */
  get size(): number {
    return this.entries.size;
  }

  /** Summed byte length of the cached bodies. */
  get totalBytes(): number {
    return this.bytes;
  }
}
