import { TestBed } from '@angular/core/testing';
import { LoopRegistry } from '../loop/loop-registry';
import { GainControl } from './gain-control';
import { TRACK_STEPS } from './gain-track';

function mount(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(GainControl);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  const root = fixture.nativeElement.shadowRoot as ShadowRoot;
  return {
    fixture,
    root,
    slider: root.querySelector('input[type=range]') as HTMLInputElement,
    field: root.querySelector('input.field') as HTMLInputElement,
  };
}

// 1/(s(s+1)(s+2)) is stable for 0 < K < 6 (Routh, by hand)
const cubic = '1/(s*(s+1)*(s+2))';

describe('GainControl', () => {
  it('shows the gain in the field and places the slider logarithmically', () => {
    const { slider, field } = mount({ model: cubic, gain: '2' });
    expect(field.value).toBe('2');
    expect(Number(slider.max)).toBe(TRACK_STEPS);
    expect(Number(slider.value)).toBeGreaterThan(0);
    expect(slider.getAttribute('aria-valuetext')).toBe('K = 2, stable');
  });

  it('draws the stable and unstable stretches of the track with a tick at the crossing gain', () => {
    const { root } = mount({ model: cubic });
    const segments = [...root.querySelectorAll('.segment')];
    expect(segments.map((s) => s.classList.contains('stable'))).toEqual([true, false]);
    const ticks = [...root.querySelectorAll('.tick')];
    expect(ticks.map((t) => t.getAttribute('title'))).toEqual(['K = 6']);
  });

  it('moves the gain of the whole loop from the slider and sends pw-gain-change', () => {
    const { fixture, slider, field } = mount({ model: cubic, loop: 'slider-test' });
    const details: unknown[] = [];
    fixture.nativeElement.addEventListener('pw-gain-change', (e: Event) => details.push((e as CustomEvent).detail));
    slider.value = String(TRACK_STEPS);
    slider.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    const gain = TestBed.inject(LoopRegistry).loop('slider-test').gain();
    expect(gain).toBeGreaterThan(6);
    expect(details).toEqual([{ gain, loop: 'slider-test' }]);
    expect(Number(field.value)).toBe(gain);
    expect(slider.getAttribute('aria-valuetext')).toMatch(/not stable$/);
  });

  it('applies a typed gain on Enter and moves the slider with it', () => {
    const { fixture, slider, field } = mount({ model: cubic, gain: '1' });
    const before = Number(slider.value);
    field.value = '4';
    field.dispatchEvent(new Event('input'));
    field.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    fixture.detectChanges();
    expect(Number(slider.value)).toBeGreaterThan(before);
    expect(slider.getAttribute('aria-valuetext')).toBe('K = 4, stable');
  });

  it('refuses a typed value that is not a positive number with a message at the field, keeping the gain', () => {
    const { fixture, root, field } = mount({ model: cubic, gain: '2', loop: 'typed' });
    field.value = 'two';
    field.dispatchEvent(new Event('input'));
    field.dispatchEvent(new Event('change'));
    fixture.detectChanges();
    expect(field.getAttribute('aria-invalid')).toBe('true');
    expect(root.querySelector('#field-message')?.textContent).toMatch(/not a number/);
    expect(TestBed.inject(LoopRegistry).loop('typed').gain()).toBe(2);
    field.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape' }));
    fixture.detectChanges();
    expect(field.value).toBe('2');
    expect(field.getAttribute('aria-invalid')).toBeNull();
  });

  it('is disabled and says why while the model is refused', () => {
    const { root, slider } = mount({ model: '{"numerator": [1, 2, 3], "denominator": [1, 1]}' });
    expect(slider.disabled).toBe(true);
    expect(root.querySelector('.status.error')?.textContent).toMatch(/numerator has degree 2/);
  });
});
