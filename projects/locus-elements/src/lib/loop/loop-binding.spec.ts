import { ChangeDetectionStrategy, Component, input, numberAttribute } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { bindLoop } from './loop-binding';
import { LoopRegistry } from './loop-registry';

@Component({
  selector: 'pwl-binding-probe',
  template: `{{ binding.state().status() }}|{{ binding.state().gain() }}|{{ binding.state().error() ?? '' }}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class BindingProbe {
  readonly model = input<unknown>();
  readonly modelId = input<string>();
  readonly token = input<string>();
  readonly loop = input<string>();
  readonly gain = input(Number.NaN, { transform: numberAttribute });
  readonly targets = input<unknown>();
  readonly binding = bindLoop({ loop: this.loop, model: this.model, modelId: this.modelId, token: this.token, gain: this.gain, targets: this.targets });
}

function probe(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(BindingProbe);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  return fixture;
}

describe('bindLoop', () => {
  it('reads the model attribute into the loop and renders its status', () => {
    const fixture = probe({ model: '1/(s*(s+2))', gain: '2' });
    expect(fixture.nativeElement.textContent).toBe('ready|2|');
    expect(fixture.componentInstance.binding.state().locus()?.branches.length).toBe(2);
  });

  it('shares model and gain between two elements with one loop key', () => {
    const a = probe({ model: '1/(s*(s+2))', loop: 'belt' });
    const b = probe({ loop: 'belt' });
    expect(b.componentInstance.binding.state()).toBe(a.componentInstance.binding.state());
    a.componentInstance.binding.setGainByUser(4);
    b.detectChanges();
    expect(b.nativeElement.textContent).toBe('ready|4|');
  });

  it('gives elements without a loop key private loops', () => {
    const a = probe({ model: '1/(s+1)' });
    const b = probe({});
    expect(b.componentInstance.binding.state()).not.toBe(a.componentInstance.binding.state());
    expect(b.componentInstance.binding.state().status()).toBe('idle');
    // the private state stays the same across change detection
    const before = a.componentInstance.binding.state();
    a.detectChanges();
    expect(a.componentInstance.binding.state()).toBe(before);
  });

  it('moves to the shared loop when the loop key changes', () => {
    const registry = TestBed.inject(LoopRegistry);
    const fixture = probe({ model: '1/(s+3)' });
    fixture.componentRef.setInput('loop', 'later');
    fixture.detectChanges();
    expect(fixture.componentInstance.binding.state()).toBe(registry.loop('later'));
    expect(registry.loop('later').model()?.plant).toEqual({ expression: '1/(s+3)' });
  });

  it('shows a bad model as an error state and tells the host page through pw-load-error', () => {
    const fixture = TestBed.createComponent(BindingProbe);
    const events: CustomEvent[] = [];
    fixture.nativeElement.addEventListener('pw-load-error', (e: Event) => events.push(e as CustomEvent));
    fixture.componentRef.setInput('model', '{"expression": "s^2/(s+1)"}');
    expect(() => fixture.detectChanges()).not.toThrow();
    expect(fixture.nativeElement.textContent).toMatch(/^error\|1\|Model not accepted: expression has degree 2/);
    expect(events.length).toBe(1);
    expect(events[0].bubbles && events[0].composed).toBe(true);
    expect(events[0].detail.message).toMatch(/has degree 2/);
  });

  it('sends pw-gain-change with the gain and the loop key for a user action, and refuses NaN', () => {
    const fixture = probe({ model: '1/(s+1)', loop: 'events' });
    const details: unknown[] = [];
    fixture.nativeElement.addEventListener('pw-gain-change', (e: Event) => details.push((e as CustomEvent).detail));
    expect(fixture.componentInstance.binding.setGainByUser(6)).toBe(true);
    expect(fixture.componentInstance.binding.setGainByUser(Number.NaN)).toBe(false);
    expect(details).toEqual([{ gain: 6, loop: 'events' }]);
  });

  it('gives the host element a setGain method that puts the gain back even when the gain property already holds it', () => {
    const fixture = probe({ model: '1/(s+1)', loop: 'reset', gain: 2 });
    const details: unknown[] = [];
    fixture.nativeElement.addEventListener('pw-gain-change', (e: Event) => details.push((e as CustomEvent).detail));
    fixture.componentInstance.binding.setGainByUser(7);
    fixture.componentRef.setInput('gain', 2); // the same value again: ignored, as for any input
    fixture.detectChanges();
    expect(fixture.componentInstance.binding.state().gain()).toBe(7);
    const host = fixture.nativeElement as HTMLElement & { setGain(k: number): boolean };
    expect(host.setGain(2)).toBe(true);
    expect(host.setGain(Number.NaN)).toBe(false);
    fixture.detectChanges();
    expect(fixture.nativeElement.textContent).toBe('ready|2|');
    expect(details).toEqual([{ gain: 7, loop: 'reset' }]);
  });

  it('asks for the token when model-id comes without one', () => {
    const fixture = probe({ modelId: 'abc' });
    expect(fixture.nativeElement.textContent).toMatch(/^error\|1\|model-id abc is set but token is missing/);
  });

  it('applies targets given as JSON text and explains text that is not JSON', () => {
    const fixture = probe({ model: '1/(s*(s+2))', targets: '{"minDampingRatio": 0.5}' });
    expect(fixture.componentInstance.binding.state().targets()).toEqual({ minDampingRatio: 0.5 });
    fixture.componentRef.setInput('targets', '{minDamping');
    fixture.detectChanges();
    expect(fixture.componentInstance.binding.targetsError()).toMatch(/targets is not valid JSON/);
    expect(fixture.componentInstance.binding.state().targets()).toBeNull();
  });
});
