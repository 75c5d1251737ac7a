import { TestBed } from '@angular/core/testing';
import { LoopRegistry } from '../loop/loop-registry';
import { StepPlot } from './step-plot';

function mount(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(StepPlot);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  return { fixture, root: fixture.nativeElement.shadowRoot as ShadowRoot };
}

describe('StepPlot', () => {
  it('draws the response at the current gain with overshoot, rise and settling marked', () => {
    // 1/(s(s+2)) at K = 2: ζ = 0.707, overshoot e^(−π) ≈ 4.32 % (second-order formula, common practice)
    const { root } = mount({ model: '1/(s*(s+2))', gain: '2' });
    expect(root.querySelector('path.response')?.getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
    expect(root.querySelector('.peak text')?.textContent).toBe('overshoot 4.321 %');
    expect(root.querySelector('.rise text')?.textContent).toMatch(/^rise [\d.]+ s$/);
    expect(root.querySelector('.settling text')?.textContent).toMatch(/^settling [\d.]+ s$/);
    expect(root.querySelector('svg')?.getAttribute('aria-label')).toMatch(/final value 1, overshoot 4.321 %/);
  });

  it('redraws when another element moves the gain of the shared loop', () => {
    const { fixture, root } = mount({ model: '1/(s*(s+2))', gain: '2', loop: 'step-shared' });
    const before = root.querySelector('path.response')?.getAttribute('d');
    TestBed.inject(LoopRegistry).loop('step-shared').setGain(20);
    fixture.detectChanges();
    expect(root.querySelector('path.response')?.getAttribute('d')).not.toBe(before);
    expect(root.querySelector('svg')?.getAttribute('aria-label')).toMatch(/^Step response at K = 20/);
  });

  it('shades the target envelope when targets are set', () => {
    const { root } = mount({ model: '1/(s*(s+2))', gain: '2', targets: '{"maxOvershootPct": 10, "maxSettlingTime": 5}' });
    expect(root.querySelectorAll('path.forbidden').length).toBe(3);
    expect(root.querySelector('path.envelope')).not.toBeNull();
  });

  it('says so when the closed loop is not stable', () => {
    const { root } = mount({ model: '1/(s*(s+1)*(s+2))', gain: '12' });
    expect(root.querySelector('path.response.unstable')).not.toBeNull();
    expect(root.querySelector('.peak')).toBeNull();
    expect(root.querySelector('figcaption')?.textContent).toMatch(/not stable/);
    expect(root.querySelector('svg')?.getAttribute('aria-label')).toMatch(/grows without bound/);
  });

  it('draws a sampled loop as steps', () => {
    const { root } = mount({ model: '{"expression": "0.4/(z-0.7)", "domain": "z", "sampleTime": 0.5}', gain: '1' });
    // a step is a vertical segment: two consecutive points with the same x
    expect(root.querySelector('path.response')?.getAttribute('d')).toMatch(/L([\d.]+),[\d.]+L\1,/);
  });

  it('shows the error message of a refused model instead of a plot', () => {
    const { root } = mount({ model: '{"numerator": [1], "denominator": [0]}' });
    expect(root.querySelector('svg')).toBeNull();
    expect(root.querySelector('.message.error')?.textContent).toMatch(/Model not accepted/);
  });
});
