import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { closedLoop, locus, type Complex } from '@polewright/locus-core';
import { DEMO_PLANTS } from '../../testing/demo-loops';
import { LoopRegistry } from '../loop/loop-registry';
import { LocusPlot } from './locus-plot';
import { ARROW_FACTOR, PAGE_FACTOR } from './plot-keys';

type Fixture = ComponentFixture<LocusPlot>;

async function render(inputs: Record<string, unknown>): Promise<Fixture> {
  const fixture = TestBed.createComponent(LocusPlot);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  fixture.detectChanges();
  await fixture.whenStable();
  return fixture;
}

const root = (f: Fixture): ShadowRoot => (f.nativeElement as HTMLElement).shadowRoot as ShadowRoot;
const all = (f: Fixture, selector: string): Element[] => [...root(f).querySelectorAll(selector)];

function events<T>(f: Fixture, name: string): T[] {
  const seen: T[] = [];
  (f.nativeElement as HTMLElement).addEventListener(name, (e) => seen.push((e as CustomEvent<T>).detail));
  return seen;
}

function press(f: Fixture, key: string, shiftKey = false): void {
  root(f).querySelector('.pw-area')?.dispatchEvent(new KeyboardEvent('keydown', { key, shiftKey, bubbles: true }));
  f.detectChanges();
}

// jsdom has no layout: getBoundingClientRect is all zeros, so client coordinates are svg pixels
function pointer(f: Fixture, type: string, x: number, y: number): void {
  const svg = root(f).querySelector('svg.pw-plot') as SVGSVGElement;
  const init = { clientX: x, clientY: y, bubbles: true, button: 0, pointerId: 1 };
  svg.dispatchEvent(typeof PointerEvent === 'undefined' ? Object.assign(new MouseEvent(type, init), { pointerId: 1 }) : new PointerEvent(type, init));
  f.detectChanges();
}

function sameSet(actual: readonly Complex[], expected: readonly Complex[], tolerance: number): boolean {
  const left = [...expected];
  return actual.every((p) => {
    const i = left.findIndex((q) => Math.hypot(q.re - p.re, q.im - p.im) <= tolerance * Math.max(1, Math.hypot(q.re, q.im)));
    if (i < 0) return false;
    left.splice(i, 1);
    return true;
  });
}

describe('LocusPlot', () => {
  it('draws one branch per closed-loop pole and one gain marker on each', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, gain: 5 });
    const poles = closedLoop({ plant: DEMO_PLANTS.beltSpeed, gain: 5 }).poles;
    expect(poles.length).toBe(4);
    expect(all(f, 'path.pw-branch').length).toBe(poles.length);
    expect(all(f, 'path.pw-branch').every((p) => (p.getAttribute('d') ?? '').startsWith('M'))).toBe(true);
    const markers = all(f, 'circle.pw-gain-marker');
    expect(markers.length).toBe(poles.length);
    expect(new Set(markers.map((m) => m.getAttribute('data-branch')))).toEqual(new Set(['0', '1', '2', '3']));
  });

  it('places the gain markers at the closed-loop poles of the core at the current gain', async () => {
    const f = await render({ model: DEMO_PLANTS.webTension, gain: 20 });
    const plot = f.componentInstance;
    const expected = closedLoop({ plant: DEMO_PLANTS.webTension, gain: 20 }).poles;
    expect(sameSet(plot.markers().map((m) => m.pole), expected, 1e-7)).toBe(true);
    const frame = plot.frame();
    const drawn = all(f, 'circle.pw-gain-marker').map((c) => ({ re: frame.x.invert(Number(c.getAttribute('cx'))), im: frame.y.invert(Number(c.getAttribute('cy'))) }));
    expect(sameSet(drawn, expected, 1e-6)).toBe(true);
  });

  it('moves the gain logarithmically with the arrow and page keys and tells the page', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, gain: 2, loop: 'keys-belt' });
    const changes = events<{ gain: number; loop: string | null }>(f, 'pw-gain-change');
    press(f, 'ArrowRight');
    expect(changes.at(-1)?.gain).toBeCloseTo(2 * ARROW_FACTOR, 12);
    expect(changes.at(-1)?.loop).toBe('keys-belt');
    press(f, 'PageDown');
    expect(changes.at(-1)?.gain).toBeCloseTo((2 * ARROW_FACTOR) / PAGE_FACTOR, 12);
    expect(TestBed.inject(LoopRegistry).loop('keys-belt').gain()).toBeCloseTo((2 * ARROW_FACTOR) / PAGE_FACTOR, 12);
    // the markers follow: they sit at the new gain's closed-loop poles
    const expected = closedLoop({ plant: DEMO_PLANTS.beltSpeed, gain: (2 * ARROW_FACTOR) / PAGE_FACTOR }).poles;
    expect(sameSet(f.componentInstance.markers().map((m) => m.pole), expected, 1e-7)).toBe(true);
    expect(root(f).querySelector('.pw-area')?.getAttribute('aria-valuetext')).toBe('K 1.191');
  });

  it('zooms with + and − and fits again with 0', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed });
    const width = (): number => {
      const x = f.componentInstance.frame().x;
      return x.invert(100) - x.invert(0);
    };
    const fitted = width();
    press(f, '+');
    expect(width()).toBeCloseTo(fitted / 1.4, 9);
    press(f, '-');
    press(f, '-');
    expect(width()).toBeCloseTo(fitted * 1.4, 9);
    press(f, '0');
    expect(width()).toBeCloseTo(fitted, 9);
  });

  it('sets the gain to that of the nearest branch point when a branch is clicked', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, gain: 1 });
    const changes = events<{ gain: number }>(f, 'pw-gain-change');
    const result = locus({ plant: DEMO_PLANTS.beltSpeed });
    // a traced point of the branch leaving the pole pair upwards, well away from the other branches
    const target = result.branches.flatMap((b) => b.points).find((p) => p.im > 7.5 && p.im < 8.5 && p.re > 0) as { gain: number; re: number; im: number };
    const frame = f.componentInstance.frame();
    pointer(f, 'pointerdown', frame.x(target.re), frame.y(target.im));
    pointer(f, 'pointerup', frame.x(target.re), frame.y(target.im));
    expect(changes.length).toBe(1);
    expect(changes[0].gain).toBeCloseTo(target.gain, 6);
  });

  it('reports the picked closed-loop pole with its gain and branch', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, gain: 5 });
    const picks = events<{ pole: Complex; gain: number; branch: number }>(f, 'pw-pole-pick');
    const marker = f.componentInstance.markers().find((m) => m.pole.im > 1) as { pole: Complex; branch: number };
    const frame = f.componentInstance.frame();
    pointer(f, 'pointerdown', frame.x(marker.pole.re), frame.y(marker.pole.im));
    pointer(f, 'pointerup', frame.x(marker.pole.re), frame.y(marker.pole.im));
    expect(picks).toEqual([{ pole: marker.pole, gain: 5, branch: marker.branch }]);
  });

  it('exports an SVG document that contains every branch', async () => {
    const f = await render({ model: DEMO_PLANTS.hoistPosition, gain: 100 });
    const svg = f.componentInstance.exportSvg();
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg.match(/xmlns="http:\/\/www.w3.org\/2000\/svg"/g)?.length).toBe(1);
    const doc = new DOMParser().parseFromString(svg, 'image/svg+xml');
    expect(doc.querySelector('parsererror')).toBeNull();
    const exported = [...doc.querySelectorAll('path.pw-branch')].map((p) => p.getAttribute('d'));
    const live = all(f, 'path.pw-branch').map((p) => p.getAttribute('d'));
    expect(exported.length).toBe(5);
    expect(exported).toEqual(live);
    // the exported drawing is the data, not the interaction aids
    expect(doc.querySelector('[data-export="skip"]')).toBeNull();
    expect((f.nativeElement as HTMLElement & { exportSvg(): string }).exportSvg()).toBe(svg);
  });

  it('adds a compensator zero where the plane is clicked and emits the edited model', async () => {
    const f = await render({ model: DEMO_PLANTS.webTension, editable: true, loop: 'edit-web' });
    const edits = events<{ plant: unknown; compensator: { zeros: Complex[]; poles: Complex[] } | null }>(f, 'pw-model-edit');
    const zerosBefore = locus({ plant: DEMO_PLANTS.webTension }).openLoop.zeros.length;
    const button = all(f, '.pw-toolbar button').find((b) => b.textContent?.includes('Zero')) as HTMLButtonElement;
    button.click();
    f.detectChanges();
    const frame = f.componentInstance.frame();
    const at = { x: frame.x(-4), y: frame.y(0) + 2 }; // two pixels off the axis: snapped onto it
    pointer(f, 'pointerdown', at.x, at.y);
    pointer(f, 'pointerup', at.x, at.y);
    expect(edits.length).toBe(1);
    expect(edits[0].plant).toEqual(DEMO_PLANTS.webTension);
    expect(edits[0].compensator?.poles).toEqual([]);
    expect(edits[0].compensator?.zeros.length).toBe(1);
    expect(edits[0].compensator?.zeros[0].re).toBeCloseTo(-4, 1);
    expect(edits[0].compensator?.zeros[0].im).toBe(0);
    // the shared loop now carries the compensator, and the locus was recomputed with the extra zero
    const state = TestBed.inject(LoopRegistry).loop('edit-web');
    expect(state.model()?.compensator).toEqual(edits[0].compensator);
    expect(state.locus()?.openLoop.zeros.length).toBe(zerosBefore + 1);
    f.detectChanges();
    expect(all(f, '[data-compensator="zero"]').length).toBe(1);
  });

  it('adds a conjugate pair of compensator poles off the real axis and removes it with Delete', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, editable: true });
    const edits = events<{ compensator: { zeros: Complex[]; poles: Complex[] } | null }>(f, 'pw-model-edit');
    (all(f, '.pw-toolbar button').find((b) => b.textContent?.includes('Pole')) as HTMLButtonElement).click();
    f.detectChanges();
    const frame = f.componentInstance.frame();
    pointer(f, 'pointerdown', frame.x(-3), frame.y(4));
    pointer(f, 'pointerup', frame.x(-3), frame.y(4));
    const poles = edits[0].compensator?.poles ?? [];
    expect(poles.length).toBe(2);
    expect(poles[0].re).toBeCloseTo(poles[1].re, 12);
    expect(poles[0].im).toBeCloseTo(-poles[1].im, 12);
    expect(Math.abs(poles[0].im)).toBeCloseTo(4, 1);
    press(f, 'Delete');
    expect(edits.length).toBe(2);
    expect(edits[1].compensator).toBeNull();
  });

  it('draws the unit circle and no imaginary-axis guides for a z-plane loop', async () => {
    const f = await render({ model: DEMO_PLANTS.chargerCurrent, gain: 1 });
    const circle = root(f).querySelector('path.pw-guide-unit-circle');
    expect(circle).not.toBeNull();
    const frame = f.componentInstance.frame();
    const numbers = (circle?.getAttribute('d') ?? '').match(/-?\d+(\.\d+)?(e-?\d+)?/g)?.map(Number) ?? [];
    expect(numbers.length).toBeGreaterThan(100);
    for (let i = 0; i + 1 < numbers.length; i += 2) {
      expect(Math.hypot(frame.x.invert(numbers[i]), frame.y.invert(numbers[i + 1]))).toBeCloseTo(1, 4);
    }
    expect(root(f).querySelector('svg')?.getAttribute('data-plane')).toBe('z');
    expect(all(f, 'path.pw-branch').length).toBe(3);
  });

  it('shades the region meeting the design targets', async () => {
    const f = await render({ model: DEMO_PLANTS.beltSpeed, targets: '{"minDampingRatio": 0.45}' });
    expect(root(f).querySelector('path.pw-region')?.getAttribute('d')).toMatch(/^M.*Z$/);
    const g = await render({ model: DEMO_PLANTS.beltSpeed });
    expect(root(g).querySelector('path.pw-region')).toBeNull();
  });

  it('lists the branches at sampled gains, the features and the stable ranges in its data table', async () => {
    const f = await render({ model: DEMO_PLANTS.hoistPosition });
    const details = root(f).querySelector('details.pw-data') as HTMLDetailsElement;
    details.open = true;
    details.dispatchEvent(new Event('toggle'));
    f.detectChanges();
    const headings = all(f, 'details thead th').map((th) => th.textContent?.trim());
    expect(headings).toEqual(['Gain K', 'Branch 1', 'Branch 2', 'Branch 3', 'Branch 4', 'Branch 5']);
    expect(all(f, 'details tbody tr').length).toBeGreaterThan(4);
    const text = details.textContent ?? '';
    expect(text).toContain('Open-loop pole (×3) at 0');
    expect(text).toContain('23.68 < K < 481.2');
  });

  it('shows why a model is refused inside the element', async () => {
    const f = await render({ model: '{"expression": "1/(s*(s+"}' });
    expect(root(f).querySelector('[role="alert"]')?.textContent).toContain('expression');
    expect(all(f, 'path.pw-branch').length).toBe(0);
  });
});
