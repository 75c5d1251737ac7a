import {
  booleanAttribute,
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  ElementRef,
  inject,
  input,
  linkedSignal,
  signal,
  untracked,
  viewChild,
  ViewEncapsulation,
  type Signal,
  type WritableSignal,
} from '@angular/core';
import type { LocusResult } from '@polewright/locus-core';
import { zoomIdentity } from 'd3-zoom';
import { dispatchHostEvent } from '../loop/host-events';
import { elementSize } from '../figures/host-size';
import { LoopElement } from '../loop/loop-element';
import { PlotAxis } from './axis';
import { asymptoteRays, featurePoints, formatGain } from './features';
import { planePath, branchPaths } from './branch';
import { locusTable, smallestTracedGain } from './data-table';
import { sPlaneGuides, zPlaneGuides } from './guides';
import { compensatorPoleMarkPath, gainMarkers, groupCoincident, poleMarkPath } from './markers';
import { CompensatorEditor } from './compensator-editor';
import { PlotExport } from './export';
import { placeLabels, visibleFixedLabels } from './labels';
import { fitExtent, frameOf, unitsPerPixel, visibleExtent, type Extent, type Frame } from './plot-frame';
import { plotKeyAction } from './plot-keys';
import { HIT, PlotPointer } from './plot-pointer';
import { nearestLocusPoint, readoutText, type LocusHit } from './readout';
import { targetRegion } from './region';
import { PlotZoom } from './zoom';

let nextPlot = 1;

/**
 * `pw-locus-plot`: the root locus of a loop in the s- or z-plane — branches, open-loop poles and zeros,
 * asymptotes, break points and boundary crossings with their gains, damping and natural-frequency guides,
 * the region meeting the design targets, and the closed-loop poles at the current gain. The gain is set by
 * clicking or dragging along a branch or with the keyboard; zoom and pan with wheel, pinch, drag or +/−;
 * with `editable`, compensator poles and zeros are added, dragged and removed. Everything drawn comes from
 * the loop's shared `locus()` result; the plot makes no stability claim of its own (the summary element
 * carries the caution).
 */
@Component({
  selector: 'pwl-locus-plot',
  imports: [PlotZoom, PlotAxis],
  templateUrl: './locus-plot.html',
  styleUrls: ['../theme/theme.css', './locus-plot.css', './plot-panel.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LocusPlot extends LoopElement {
  /** Whether compensator poles and zeros can be added, dragged and removed on the plot. */
  readonly editable = input(false, { transform: booleanAttribute });
  /** Accessible name of the plot. */
  readonly label = input<string | null>(null);

  protected readonly result = computed(() => this.state().locus());
  protected readonly status = computed(() => this.state().status());
  protected readonly error = computed(() => this.state().error());
  protected readonly currentGain = computed(() => this.state().gain());
  protected readonly uid = `pw-plot-${nextPlot++}`;
  protected readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  protected readonly zoomer = viewChild(PlotZoom);
  protected readonly svg = viewChild<ElementRef<SVGSVGElement>>('svg');
  protected readonly area = viewChild<ElementRef<HTMLElement>>('area');
  protected readonly size = elementSize(this.area, { width: 640, height: 380 });
  protected readonly editor: CompensatorEditor = new CompensatorEditor({
    state: () => this.state(),
    result: () => this.result(),
    snap: (): number => 6 * unitsPerPixel(this.frame()),
    emit: (detail) => dispatchHostEvent(this.host, 'pw-model-edit', detail),
  });
  protected readonly exporter = new PlotExport({ svg: () => this.svg()?.nativeElement ?? null, host: this.host });
  /** The fitted view; kept while this plot's own edits change the locus, refitted for a new model. */
  protected readonly fit: WritableSignal<Extent | null> = linkedSignal<{ result: LocusResult | null; own: boolean }, Extent | null>({
    source: (): { result: LocusResult | null; own: boolean } => ({ result: this.result(), own: this.state().model() === this.editor.ownModel() }),
    computation: (source, previous) => (source.own && previous?.value ? previous.value : source.result ? fitExtent(source.result) : null),
  });
  readonly frame: Signal<Frame> = computed((): Frame => frameOf(this.size(), this.fit() ?? { minRe: -1, maxRe: 1, minIm: -1, maxIm: 1 }, this.zoomer()?.transform() ?? zoomIdentity));
  protected readonly view = computed(() => visibleExtent(this.frame()));
  protected readonly plane = computed(() => this.result()?.domain ?? 's');
  protected readonly gridX = computed(() => this.frame().x.ticks(8));
  protected readonly gridY = computed(() => this.frame().y.ticks(6));
  protected readonly guides = computed(() => {
    const frame = this.frame();
    const all = this.plane() === 's' ? sPlaneGuides(this.view()) : zPlaneGuides();
    const guides = all.map((g) => ({ kind: g.kind, d: planePath(g.points, frame), label: g.label, anchor: g.anchor ?? 'start', dy: g.below ? 12 : -3, at: g.labelAt ? [frame.x(g.labelAt.re), frame.y(g.labelAt.im)] : null }));
    // crowded guide labels (a small plot) are thinned out rather than drawn over each other
    const labelled = guides.filter((g) => g.at && g.label);
    const shown = visibleFixedLabels(labelled.map((g) => ({ x: (g.at as number[])[0] + (g.anchor === 'end' ? -3 : 3), y: (g.at as number[])[1] + g.dy, text: g.label, anchor: g.anchor })));
    return guides.map((g) => (g.at && g.label && !shown[labelled.indexOf(g)] ? { ...g, label: '' } : g));
  });
  protected readonly regionPath = computed(() => {
    const result = this.result();
    const design = this.state().design();
    const outline = result && design ? targetRegion(design.region, result.domain, result.sampleTime, this.view()) : null;
    const frame = this.frame();
    return outline ? `M${outline.map((p) => `${frame.x(p.re)},${frame.y(p.im)}`).join('L')}Z` : null;
  });
  protected readonly branches = computed(() => {
    const result = this.result();
    return result ? branchPaths(result, this.frame()) : [];
  });
  protected readonly asymptotes = computed(() => {
    const result = this.result();
    return result ? asymptoteRays(result, this.view()).map((a) => planePath(a.points, this.frame())) : [];
  });
  protected readonly features = computed(() => {
    const result = this.result();
    const frame = this.frame();
    return result ? featurePoints(result).map((f) => ({ ...f, x: frame.x(f.point.re), y: frame.y(f.point.im) })) : [];
  });
  /** Gain labels of the features and multiplicity labels (×2) of the open-loop marks, placed clear of each other. */
  protected readonly labels = computed(() => {
    const { poles, zeros } = this.openLoop();
    const features = this.features();
    const requests = [
      ...[...poles, ...zeros].filter((g) => g.count > 1).map((g) => ({ x: g.x, y: g.y, text: `×${g.count}`, kind: 'pw-count' })),
      ...features.filter((f) => f.label).map((f) => ({ x: f.x, y: f.y, text: f.label, kind: 'pw-feature-label' })),
    ];
    const marks = [...features, ...poles, ...zeros].map((m) => [m.x, m.y] as const);
    const { left, right, top, bottom } = this.frame().inner;
    const placed = placeLabels(requests, { x0: left, x1: right, y0: top, y1: bottom }, marks);
    return requests.map((r, i) => ({ ...placed[i], text: r.text, kind: r.kind })).filter((l) => l.visible);
  });
  protected readonly openLoop = computed(() => {
    const result = this.result();
    const frame = this.frame();
    if (!result) return { poles: [], zeros: [] };
    const { poles, zeros } = this.editor.plantPart(result.openLoop);
    const place = (g: { point: { re: number; im: number }; count: number }) => ({ ...g, x: frame.x(g.point.re), y: frame.y(g.point.im) });
    return { poles: groupCoincident(poles).map(place), zeros: groupCoincident(zeros).map(place) };
  });
  readonly markers = computed(() => {
    const result = this.result();
    return result ? gainMarkers(result, this.currentGain()) : [];
  });
  protected readonly markerDots = computed(() => this.markers().map((m) => ({ ...m, x: this.frame().x(m.pole.re), y: this.frame().y(m.pole.im) })));
  /** The pointer position the read-out follows (and the branch a gain drag keeps to). */
  protected readonly hoverAt = signal<{ x: number; y: number; branch?: number } | null>(null);
  /** The locus point under the pointer, recomputed when the locus or the view changes under a still pointer. */
  protected readonly hover = computed<LocusHit | null>(() => {
    const at = this.hoverAt();
    const result = this.result();
    if (!at || !result) return null;
    return nearestLocusPoint(result, this.frame(), at.x, at.y, at.branch === undefined ? HIT.hover : Infinity, at.branch);
  });
  protected readonly readout = computed(() => {
    const hit = this.hover();
    return hit ? { text: readoutText(hit), x: this.frame().x(hit.point.re), y: this.frame().y(hit.point.im) } : null;
  });
  protected readonly tableOpen = signal(false);
  protected readonly table = computed(() => {
    const result = this.result();
    return this.tableOpen() && result ? locusTable(result) : null;
  });
  protected readonly gainSpan = computed(() => {
    const result = this.result();
    return { floor: (result && smallestTracedGain(result)) ?? 1, max: result?.gainSpan.max ?? 1 };
  });
  protected readonly gainText = computed(() => `K ${formatGain(this.currentGain())}`);
  protected readonly poleMark = poleMarkPath();
  protected readonly compensatorPoleMark = compensatorPoleMarkPath();
  protected readonly pointer = new PlotPointer({
    frame: () => this.frame(),
    result: () => this.result(),
    markers: () => this.markers(),
    handles: () => this.editor.handles(),
    tool: () => this.editor.tool(),
    editable: () => this.editable(),
    setGain: (gain) => this.setGain(gain),
    pickPole: (m) => dispatchHostEvent(this.host, 'pw-pole-pick', { pole: { re: m.pole.re, im: m.pole.im }, gain: this.currentGain(), branch: m.branch }),
    hover: (at) => this.hoverAt.set(at),
    selectHandle: (h) => this.editor.select(h),
    moveHandle: (h, to, final) => this.editor.move(h, to, final),
    addPoint: (kind, at) => this.editor.add(kind, at),
  });
  protected readonly claims = (): boolean => this.pointer.active;

  constructor() {
    super();
    // a model from elsewhere (attribute, API, another element) gets a fresh view; this plot's own edits keep it
    effect(() => {
      const model = this.state().model();
      if (model !== untracked(this.editor.ownModel)) untracked(() => this.zoomer()?.resetZoom());
    });
    // the custom element exposes the export methods to the host page
    Object.assign(this.host, { exportSvg: () => this.exportSvg(), exportPng: () => this.exportPng() });
  }

  /** The plot as a standalone SVG document (styles inlined). */
  exportSvg(): string {
    return this.exporter.svg();
  }

  /** The plot as a PNG image at twice its size. */
  exportPng(): Promise<Blob> {
    return this.exporter.png();
  }

  /** Sets the loop's gain as a user action of this plot (sends `pw-gain-change`). */
  setGain(gain: number): void {
    if (Number.isFinite(gain) && gain >= 0) this.binding.setGainByUser(gain);
  }

  /** Zooms by `factor` about the centre. */
  zoomBy(factor: number): void {
    this.zoomer()?.zoomBy(factor);
  }

  /** Back to the fitted view of the current locus. */
  resetZoom(): void {
    const result = this.result();
    if (result) this.fit.set(fitExtent(result));
    this.zoomer()?.resetZoom();
  }

  protected keydown(event: KeyboardEvent): void {
    const action = plotKeyAction(event.key, this.currentGain(), this.gainSpan(), event.shiftKey);
    if (!action) return;
    event.preventDefault();
    if (action.kind === 'gain') this.setGain(action.gain);
    else if (action.kind === 'zoom') this.zoomBy(action.factor);
    else if (action.kind === 'reset') this.resetZoom();
    else if (action.kind === 'remove') this.editor.removeSelected();
    else {
      this.pointer.cancel();
      this.editor.cancel();
    }
  }

  protected pointerDown(event: PointerEvent): void {
    const [x, y] = this.local(event);
    if (this.pointer.down(x, y)) {
      event.preventDefault();
      (event.currentTarget as Element | null)?.setPointerCapture?.(event.pointerId);
      this.area()?.nativeElement.focus({ preventScroll: true });
    }
  }

  protected pointerMove(event: PointerEvent): void {
    const [x, y] = this.local(event);
    this.pointer.move(x, y);
  }

  protected pointerUp(event: PointerEvent): void {
    const [x, y] = this.local(event);
    this.pointer.up(x, y);
  }

  protected pointerLeave(): void {
    if (!this.pointer.active) this.hoverAt.set(null);
  }

  protected downloadPng(): void {
    this.exporter.downloadPng((message) => this.editor.notice.set(`No PNG: ${message}`));
  }

  private local(event: MouseEvent): [number, number] {
    const box = this.svg()?.nativeElement.getBoundingClientRect();
    return [event.clientX - (box?.left ?? 0), event.clientY - (box?.top ?? 0)];
  }
}
