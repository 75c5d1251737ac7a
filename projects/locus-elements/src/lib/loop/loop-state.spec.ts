import { CAUTION } from '@polewright/locus-core';
import { readModel } from './loop-model';
import { DEFAULT_GAIN, LoopState } from './loop-state';

const beltLike = () => readModel({ expression: '4*(s+2)/(s*(s+1)*(s^2+6*s+25))' });

describe('LoopState', () => {
  it('starts idle at the default gain with nothing computed', () => {
    const state = new LoopState(null);
    expect(state.status()).toBe('idle');
    expect(state.gain()).toBe(DEFAULT_GAIN);
    expect(state.locus()).toBeNull();
    expect(state.closedLoop()).toBeNull();
    expect(state.error()).toBeNull();
  });

  it('computes the locus once per model and shares the very same result with every reader', () => {
    const state = new LoopState('a');
    state.setModel(beltLike());
    expect(state.status()).toBe('ready');
    const first = state.locus();
    expect(first?.branches.length).toBe(4);
    expect(state.locus()).toBe(first);
    state.setGain(3);
    // a new gain gives a new closed loop but leaves the traced locus alone
    expect(state.locus()).toBe(first);
    expect(state.closedLoop()?.gain).toBe(3);
    expect(state.closedLoop()?.caution).toBe(CAUTION);
  });

  it('keeps the dead-time note in the locus warnings once a compensator is in series', () => {
    const state = new LoopState(null);
    state.setModel({ plant: { expression: '1/(s+1)', deadTime: 0.5 }, compensator: { zeros: [{ re: -2, im: 0 }], poles: [{ re: -8, im: 0 }], gain: 1 } });
    expect(state.locus()?.warnings.filter((w) => w.code === 'dead-time-approximated').length).toBe(1);
  });

  it('follows the gain: the closed-loop poles at K satisfy D + K·N = 0', () => {
    // 1/(s(s+2)) at K = 2: s² + 2s + 2 = 0 → s = −1 ± j (solved by hand)
    const state = new LoopState(null);
    state.setModel(readModel('1/(s*(s+2))'));
    state.setGain(2);
    const poles = state.closedLoop()!.poles.map((p) => [p.re, Math.abs(p.im)]);
    for (const [re, im] of poles) {
      expect(re).toBeCloseTo(-1, 9);
      expect(im).toBeCloseTo(1, 9);
    }
  });

  it('refuses a gain that is not a finite number and keeps the previous one', () => {
    const state = new LoopState(null);
    expect(state.setGain(5, 'x')).toBe(true);
    expect(state.setGain(Number.NaN)).toBe(false);
    expect(state.setGain(Number.POSITIVE_INFINITY)).toBe(false);
    expect(state.gain()).toBe(5);
    expect(state.gainChange()).toEqual({ gain: 5, source: 'x' });
  });

  it('publishes each distinct gain on gain$', () => {
    const state = new LoopState(null);
    const seen: number[] = [];
    const subscription = state.gain$.subscribe((g) => seen.push(g));
    state.setGain(2);
    state.setGain(2);
    state.setGain(7);
    subscription.unsubscribe();
    expect(seen).toEqual([DEFAULT_GAIN, 2, 7]);
  });

  it('puts a reported error in the state without losing the previous model', () => {
    const state = new LoopState(null);
    const model = beltLike();
    state.setModel(model);
    state.reportError('The model is not valid JSON.');
    expect(state.status()).toBe('error');
    expect(state.error()).toBe('The model is not valid JSON.');
    expect(state.model()).toBe(model);
    state.setModel(model);
    expect(state.status()).toBe('ready');
    expect(state.error()).toBeNull();
  });

  it('turns a compensator that makes the loop improper into an error state, not an exception', () => {
    const state = new LoopState(null);
    state.setModel({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1, im: 0 }, { re: -2, im: 0 }], poles: [], gain: 1 } });
    expect(() => state.locus()).not.toThrow();
    expect(state.status()).toBe('error');
    expect(state.error()).toMatch(/compensator › zeros makes the loop improper/);
    expect(state.closedLoop()).toBeNull();
  });

  it('reports a gain at which the loop is ill-posed through closedLoopError', () => {
    // biproper (s+1)/(s+2): 1 + K·1 = 0 at K = −1 (leading coefficients, by hand)
    const state = new LoopState(null);
    state.setModel(readModel('(s+1)/(s+2)'));
    state.setGain(-1);
    expect(state.closedLoop()).toBeNull();
    expect(state.closedLoopError()).toMatch(/ill-posed/);
    expect(state.status()).toBe('ready');
  });

  it('applies design targets and drops them again', () => {
    const state = new LoopState(null);
    state.setModel(beltLike());
    expect(state.design()).toBeNull();
    state.setTargets({ minDampingRatio: 0.5 });
    const design = state.design();
    expect(design?.region.minDampingRatio).toBe(0.5);
    expect(design!.gainRanges.length).toBeGreaterThan(0);
    state.setTargets(null);
    expect(state.design()).toBeNull();
  });

  it('explains targets the core refuses without touching the loop status', () => {
    const state = new LoopState(null);
    state.setModel(beltLike());
    state.setTargets({ minDampingRatio: 3 } as never);
    expect(state.design()).toBeNull();
    expect(state.designError()).toMatch(/Targets not accepted: targets › minDampingRatio must be a number between 0 and 1/);
    expect(state.status()).toBe('ready');
  });

  it('refuses to load from the API when it has no HTTP client, with a message', async () => {
    const state = new LoopState(null, null);
    const outcome = await state.loadFromApi({ apiBase: '/api', modelId: 'm1', token: 'pwe_x' });
    expect(outcome.ok).toBe(false);
    expect(state.status()).toBe('error');
    expect(state.error()).toMatch(/not available/);
  });
});
