/**
 * In-memory LRU of serialised locus results keyed by the SHA-256 of the loop content, bounded by the
 * total size of the stored text. In memory on purpose: a result belongs to the engine build that computed
 * it, so it must not outlive the process (a persistent table would serve stale numbers after an upgrade).
 */
export class LocusCache {
  private readonly entries = new Map<string, string>();
  private bytes = 0;

  /** @param maxBytes upper bound of the summed length of the cached texts (UTF-16 code units). */
  constructor(private readonly maxBytes = 32 * 1024 * 1024) {}

  /** The cached text for `hash`, marking it most recently used; undefined on a miss. */
  get(hash: string): string | undefined {
    const text = this.entries.get(hash);
    if (text === undefined) return undefined;
    this.entries.delete(hash);
    this.entries.set(hash, text);
    return text;
  }

  /** Stores `text` under `hash`, evicting the least recently used entries beyond the size bound. */
  set(hash: string, text: string): void {
    const old = this.entries.get(hash);
    if (old !== undefined) {
      this.bytes -= old.length;
      this.entries.delete(hash);
    }
    if (text.length > this.maxBytes) return;
    this.entries.set(hash, text);
    this.bytes += text.length;
    for (const [key, value] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(key);
      this.bytes -= value.length;
    }
  }

  /** Number of cached results. */
  get size(): number {
    return this.entries.size;
  }
}
