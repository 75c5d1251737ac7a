import { TestBed } from '@angular/core/testing';
import { LoopRegistry } from '../loop/loop-registry';
import { LoopStudio } from './loop-studio';

function mount(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(LoopStudio);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  return { fixture, root: fixture.nativeElement.shadowRoot as ShadowRoot };
}

const part = (root: ShadowRoot, tag: string) => root.querySelector(tag)?.shadowRoot as ShadowRoot;

describe('LoopStudio', () => {
  it('lays out the five parts on one loop, all showing the studio model and gain', () => {
    const { root } = mount({ model: '1/(s*(s+1)*(s+2))', gain: '2', loop: 'studio-a' });
    expect([...root.querySelectorAll('.part')].map((e) => e.localName)).toEqual(['pwl-locus-plot', 'pwl-gain-control', 'pwl-stability-summary', 'pwl-step-plot', 'pwl-pole-table']);
    expect(part(root, 'pwl-pole-table').querySelector('caption')?.textContent).toBe('Closed-loop poles at K = 2 — stable');
    expect(part(root, 'pwl-stability-summary').querySelector('.ranges li')?.textContent?.trim()).toBe('0 < K < 6');
    expect((part(root, 'pwl-gain-control').querySelector('input.field') as HTMLInputElement).value).toBe('2');
    expect(TestBed.inject(LoopRegistry).loop('studio-a').gain()).toBe(2);
  });

  it('gives each studio without a loop key a loop of its own', () => {
    const a = mount({ model: '1/(s+1)', gain: '3' });
    const b = mount({ model: '1/(s+2)', gain: '7' });
    expect(part(a.root, 'pwl-pole-table').querySelector('caption')?.textContent).toBe('Closed-loop poles at K = 3 — stable');
    expect(part(b.root, 'pwl-pole-table').querySelector('caption')?.textContent).toBe('Closed-loop poles at K = 7 — stable');
  });

  it('heads the studio with its label, else the model name', () => {
    const { fixture, root } = mount({ model: '{"plant": {"expression": "1/(s+1)"}, "name": "Dryer supply air"}' });
    expect(root.querySelector('.heading')?.textContent).toBe('Dryer supply air');
    fixture.componentRef.setInput('label', 'Supply air');
    fixture.detectChanges();
    expect(root.querySelector('.heading')?.textContent).toBe('Supply air');
  });

  it('passes its theme to every part', () => {
    const { root } = mount({ model: '1/(s+1)', theme: 'dark' });
    expect([...root.querySelectorAll('.part')].every((e) => e.getAttribute('theme') === 'dark')).toBe(true);
  });
});
