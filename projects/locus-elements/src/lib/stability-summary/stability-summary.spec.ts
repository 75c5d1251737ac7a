import { TestBed } from '@angular/core/testing';
import { CAUTION } from '@polewright/locus-core';
import { StabilitySummary } from './stability-summary';

function mount(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(StabilitySummary);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  return { fixture, root: fixture.nativeElement.shadowRoot as ShadowRoot };
}

const texts = (root: ShadowRoot, selector: string) => [...root.querySelectorAll(selector)].map((e) => e.textContent?.trim());

describe('StabilitySummary', () => {
  it('lists the stable range, the crossing gain and the gain margin of a loop stable up to a limit', () => {
    // 1/(s(s+1)(s+2)): stable for 0 < K < 6, crossing at ±√2 j (Routh, by hand); at K = 2 the margin is ×3 = 9.542 dB
    const { root } = mount({ model: '1/(s*(s+1)*(s+2))', gain: '2' });
    expect(root.querySelector('.verdict')?.textContent?.trim()).toBe('At K = 2 the closed loop is stable.');
    expect(texts(root, '.ranges li')).toEqual(['0 < K < 6']);
    expect(texts(root, '.crossings li')).toEqual(['K = 6: imaginary axis at ±1.414j (ω = 1.414 rad/s)']);
    expect(texts(root, '.limits li')).toEqual(['Gain margin ×3 (9.542 dB): instability at K = 6 if the gain rises that much.']);
  });

  it('always carries the safety caution', () => {
    const { root } = mount({ model: '1/(s+1)' });
    expect(root.querySelector('.caution')?.textContent).toContain(CAUTION);
    expect(texts(root, '.ranges li')).toEqual(['K > 0']);
  });

  it('shows both limits of a conditionally stable loop and marks the nearer one', () => {
    // the demo hoist loop: stable only within a band of gains
    const { fixture, root } = mount({ model: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))', gain: '30' });
    const ranges = texts(root, '.ranges li');
    expect(ranges.length).toBe(1);
    expect(ranges[0]).toMatch(/^[\d.,]+ < K < [\d.,]+$/);
    expect(root.querySelector('.note')?.textContent).toMatch(/Conditionally stable/);
    const limits = texts(root, '.limits li');
    expect(limits.length).toBe(2);
    expect(root.querySelectorAll('.limits li.nearest').length).toBe(1);
    expect(fixture.nativeElement.shadowRoot.querySelector('.badge')?.textContent).toBe('nearest');
  });

  it('points an unstable gain to the nearest stable gain', () => {
    const { root } = mount({ model: '1/(s*(s+1)*(s+2))', gain: '12' });
    expect(root.querySelector('.verdict')?.textContent?.trim()).toBe('At K = 12 the closed loop is not stable.');
    expect(texts(root, '.limits li')).toEqual(['Stable below K = 6, ×2 (6.021 dB) lower.']);
  });

  it('shows the reason instead of figures when the model is refused', () => {
    const { root } = mount({ model: 'not a plant ((' });
    expect(root.querySelector('.ranges')).toBeNull();
    expect(root.querySelector('.status.error')?.textContent).toMatch(/Model not accepted/);
    expect(root.querySelector('.caution')).not.toBeNull();
  });
});
