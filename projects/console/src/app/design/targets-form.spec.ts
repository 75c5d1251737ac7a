import { dampingFromOvershoot, designForm, formValueOf, sameTargets, targetsOf } from './targets-form';

describe('targets form', () => {
  it('turns filled fields into DesignTargets and leaves empty ones out', () => {
    const form = designForm();
    form.patchValue({ targets: { minDampingRatio: 0.45, maxOvershootPct: 10, naturalFrequency: { max: 8 } } });
    expect(form.valid).toBe(true);
    expect(targetsOf(form.getRawValue().targets)).toEqual({ minDampingRatio: 0.45, maxOvershootPct: 10, naturalFrequency: { max: 8 } });
  });

  it('gives null when no target is set, and shows saved targets back in the fields', () => {
    const form = designForm();
    expect(targetsOf(form.getRawValue().targets)).toBeNull();
    form.setValue(formValueOf({ maxSettlingTime: 4, naturalFrequency: { min: 1 } }, true));
    expect(form.getRawValue()).toEqual({ targets: { minDampingRatio: null, maxSettlingTime: 4, maxOvershootPct: null, naturalFrequency: { min: 1, max: null } }, dominantOnly: true });
    expect(targetsOf(form.getRawValue().targets)).toEqual({ maxSettlingTime: 4, naturalFrequency: { min: 1 } });
  });

  it('refuses what the contract refuses: ζ outside (0, 1), settling ≤ 0, overshoot outside (0, 100), ωn min ≥ max', () => {
    const form = designForm();
    const t = form.controls.targets.controls;
    for (const bad of [0, 1, -0.2, 1.5]) {
      t.minDampingRatio.setValue(bad);
      expect(t.minDampingRatio.hasError('range')).toBe(true);
    }
    t.minDampingRatio.setValue(0.7);
    expect(t.minDampingRatio.valid).toBe(true);
    t.maxSettlingTime.setValue(0);
    expect(t.maxSettlingTime.invalid).toBe(true);
    t.maxOvershootPct.setValue(100);
    expect(t.maxOvershootPct.invalid).toBe(true);
    t.naturalFrequency.setValue({ min: 5, max: 5 });
    expect(t.naturalFrequency.controls.min.hasError('band')).toBe(true);
    // changing max alone re-checks min
    t.naturalFrequency.controls.max.setValue(6);
    expect(t.naturalFrequency.controls.min.valid).toBe(true);
    t.naturalFrequency.controls.min.setValue(0);
    expect(t.naturalFrequency.controls.min.valid).toBe(true);
  });

  it('compares targets by what they ask for', () => {
    expect(sameTargets(null, {})).toBe(true);
    expect(sameTargets({ minDampingRatio: 0.5 }, { minDampingRatio: 0.5 })).toBe(true);
    expect(sameTargets({ minDampingRatio: 0.5 }, { minDampingRatio: 0.5, maxSettlingTime: 3 })).toBe(false);
    expect(sameTargets({ naturalFrequency: {} }, null)).toBe(true);
  });

  it('turns an overshoot into the damping ratio of the second-order relation', () => {
    // ζ = −ln(0.05)/√(π² + ln²(0.05)) ≈ 0.6901 (standard second-order relation, value recalled from memory)
    expect(dampingFromOvershoot(5)).toBeCloseTo(0.6901, 4);
    // 16.3 % overshoot is the classic ζ = 0.5 (recalled from memory)
    expect(dampingFromOvershoot(16.303)).toBeCloseTo(0.5, 3);
  });
});
