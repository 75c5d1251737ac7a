import { describe, expect, it } from 'vitest';
import { type CachedLocus, LocusCache } from './locus-cache.js';

const entry = (text: string): CachedLocus => ({ body: Buffer.from(text), etag: `"${text}"` });

describe('LocusCache', () => {
  it('returns what was stored and misses what was not', () => {
    const cache = new LocusCache(100);
    cache.set('a', entry('alpha'));
    expect(cache.get('a')?.body.toString()).toBe('alpha');
    expect(cache.get('a')?.etag).toBe('"alpha"');
    expect(cache.get('b')).toBeUndefined();
  });

  it('evicts the least recently used entries once the size bound is passed', () => {
    const cache = new LocusCache(10);
    cache.set('a', entry('xxxx'));
    cache.set('b', entry('yyyy'));
    cache.get('a'); // a is now the most recently used
    cache.set('c', entry('zzzz')); // 12 > 10: b goes
    expect(cache.get('b')).toBeUndefined();
    expect(cache.get('a')?.body.toString()).toBe('xxxx');
    expect(cache.get('c')?.body.toString()).toBe('zzzz');
    expect(cache.size).toBe(2);
    expect(cache.totalBytes).toBe(8);
  });

  it('counts bytes, not characters', () => {
    const cache = new LocusCache(10);
    cache.set('a', entry('ζζζζ')); // 8 bytes in UTF-8
    cache.set('b', entry('ωω')); // 4 more: a goes
    expect(cache.get('a')).toBeUndefined();
    expect(cache.totalBytes).toBe(4);
  });

  it('never keeps a body larger than the whole bound', () => {
    const cache = new LocusCache(3);
    cache.set('a', entry('too long'));
    expect(cache.size).toBe(0);
  });
});
