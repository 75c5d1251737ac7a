import { TestBed } from '@angular/core/testing';
import { LoopRegistry } from './loop-registry';

describe('LoopRegistry', () => {
  it('gives every caller of one key the same state, and a different key another', () => {
    const registry = TestBed.inject(LoopRegistry);
    const a = registry.loop('line-3');
    expect(registry.loop('line-3')).toBe(a);
    expect(registry.loop(' line-3 ')).toBe(a);
    expect(registry.loop('hoist-2')).not.toBe(a);
    expect(a.key).toBe('line-3');
    expect(registry.keys()).toEqual(['line-3', 'hoist-2']);
  });

  it('gives a fresh private state for a null or blank key and never registers it', () => {
    const registry = TestBed.inject(LoopRegistry);
    const first = registry.loop(null);
    expect(registry.loop(null)).not.toBe(first);
    expect(registry.loop('   ')).not.toBe(first);
    expect(first.key).toBeNull();
    expect(registry.keys()).toEqual([]);
  });

  it('shares the gain between two holders of one key', () => {
    const registry = TestBed.inject(LoopRegistry);
    registry.loop('shared').setGain(12, 'slider');
    expect(registry.loop('shared').gain()).toBe(12);
    expect(registry.loop(null).gain()).not.toBe(12);
  });
});
