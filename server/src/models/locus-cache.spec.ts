import { describe, expect, it } from 'vitest';
import { LocusCache } from './locus-cache.js';

describe('LocusCache', () => {
  it('returns what was stored and misses what was not', () => {
    const cache = new LocusCache(100);
    cache.set('a', 'alpha');
    expect(cache.get('a')).toBe('alpha');
    expect(cache.get('b')).toBeUndefined();
  });

  it('evicts the least recently used entries once the size bound is passed', () => {
    const cache = new LocusCache(10);
    cache.set('a', 'xxxx');
    cache.set('b', 'yyyy');
    cache.get('a'); // a is now the most recently used
    cache.set('c', 'zzzz'); // 12 > 10: b goes
    expect(cache.get('b')).toBeUndefined();
    expect(cache.get('a')).toBe('xxxx');
    expect(cache.get('c')).toBe('zzzz');
    expect(cache.size).toBe(2);
  });

  it('never keeps a text larger than the whole bound', () => {
    const cache = new LocusCache(3);
    cache.set('a', 'too long');
    expect(cache.size).toBe(0);
  });
});
