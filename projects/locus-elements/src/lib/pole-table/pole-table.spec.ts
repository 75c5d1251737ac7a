import { TestBed } from '@angular/core/testing';
import { PoleTable } from './pole-table';

function mount(inputs: Record<string, unknown>) {
  const fixture = TestBed.createComponent(PoleTable);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  return { fixture, root: fixture.nativeElement.shadowRoot as ShadowRoot };
}

describe('PoleTable', () => {
  it('is a real table with column headers and one row per pole or conjugate pair', () => {
    // 1/(s(s+2)) at K = 2: s² + 2s + 2 → −1 ± j, ζ = 1/√2, ωn = √2, τ = 1 s (by hand)
    const { root } = mount({ model: '1/(s*(s+2))', gain: '2' });
    const headers = [...root.querySelectorAll('thead th')].map((th) => th.textContent?.trim());
    expect(headers).toEqual(['Pole (s)', 'ζ', 'ωn (rad/s)', 'τ (s)', 'Stable']);
    const rows = [...root.querySelectorAll('tbody tr')].map((tr) => [...tr.children].map((c) => c.textContent?.trim()));
    expect(rows).toEqual([['−1 ± 1j', '0.7071', '1.414', '1', 'yes']]);
    expect(root.querySelector('caption')?.textContent).toBe('Closed-loop poles at K = 2 — stable');
  });

  it('follows the gain of its loop and marks unstable poles', () => {
    const { fixture, root } = mount({ model: '1/(s*(s+1)*(s+2))', gain: '1' });
    fixture.componentRef.setInput('gain', '10');
    fixture.detectChanges();
    expect(root.querySelector('caption')?.textContent).toBe('Closed-loop poles at K = 10 — not stable');
    expect(root.querySelectorAll('tbody tr.unstable').length).toBe(1);
    expect(root.querySelector('tbody tr.unstable td:last-child')?.textContent?.trim()).toBe('no');
  });

  it('names the z-plane for a sampled loop', () => {
    const { root } = mount({ model: '{"expression": "0.5/(z-0.5)", "domain": "z", "sampleTime": 0.1}' });
    expect(root.querySelector('thead th')?.textContent?.trim()).toBe('Pole (z)');
    // 1 + K·0.5/(z − 0.5) = 0 at K = 1 → z = 0 (by hand)
    expect(root.querySelector('tbody th')?.textContent?.trim()).toBe('0');
  });

  it('shows the reason when there is no model to tabulate', () => {
    const { root } = mount({ model: '{"expression": 5}' });
    expect(root.querySelector('table')).toBeNull();
    expect(root.querySelector('.status.error')?.textContent).toMatch(/expression must be a string/);
  });
});
