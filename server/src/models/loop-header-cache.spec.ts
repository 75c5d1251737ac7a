import { describe, expect, it } from 'vitest';
import { LOOP_HEADER_TTL_MS, LoopHeaderCache } from './loop-header-cache.js';

const HEADER = { revision: 3, deletedAt: null, contentHash: 'a'.repeat(64) };

describe('LoopHeaderCache', () => {
  it('reuses a header within its TTL only', () => {
    const cache = new LoopHeaderCache();
    cache.set('m', HEADER, cache.generation, 0);
    expect(cache.get('m', LOOP_HEADER_TTL_MS - 1)).toEqual(HEADER);
    expect(cache.get('m', LOOP_HEADER_TTL_MS)).toBeUndefined();
  });

  it('forgets a model after a write and refuses a header read before it', () => {
    const cache = new LoopHeaderCache();
    cache.set('m', HEADER, cache.generation, 0);
    const readStarted = cache.generation;
    cache.forget('m');
    expect(cache.get('m', 0)).toBeUndefined();
    cache.set('m', HEADER, readStarted, 0);
    expect(cache.get('m', 0)).toBeUndefined();
  });
});
