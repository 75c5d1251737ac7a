import type { Complex, LocusResult } from '@polewright/locus-core';
import type { EditTool, Handle } from './compensator-points';
import type { GainMarker } from './markers';
import type { Frame } from './plot-frame';
import { nearestLocusPoint } from './readout';

/** Pixel radii within which a press takes a compensator point, a gain marker or a branch. */
export const HIT = { handle: 11, marker: 9, branch: 9, hover: 28, moved: 3 } as const;

/** What the pointer gestures act on: the plot component. */
export interface PointerHost {
  frame(): Frame;
  result(): LocusResult | null;
  markers(): readonly GainMarker[];
  handles(): readonly Handle[];
  tool(): EditTool;
  editable(): boolean;
  setGain(gain: number): void;
  pickPole(marker: GainMarker): void;
  /** Where the read-out looks for the nearest locus point (px), on one branch when given; null hides it. */
  hover(at: { x: number; y: number; branch?: number } | null): void;
  selectHandle(handle: Handle | null): void;
  moveHandle(handle: Handle, to: Complex, final: boolean): void;
  addPoint(kind: 'zero' | 'pole', at: Complex): void;
}

type Gesture =
  | { kind: 'gain'; branch: number }
  | { kind: 'marker'; marker: GainMarker; x: number; y: number; moved: boolean }
  | { kind: 'handle'; handle: Handle; x: number; y: number; moved: boolean }
  | { kind: 'add'; tool: 'zero' | 'pole' };

/**
 * The plot's pointer gestures, apart from zoom and pan (d3-zoom): a press near a compensator point drags
 * it (editable plots), near a gain marker picks that pole (or drags the gain when moved), near a branch
 * sets the gain there and follows the pointer along that branch; with an add tool on, a press on the plane
 * adds the point. Presses on nothing of these are left to d3-zoom (pan). Coordinates are svg pixels.
 */
export class PlotPointer {
  private gesture: Gesture | null = null;

  constructor(private readonly host: PointerHost) {}

  /** Whether a gesture is under way (d3-zoom then leaves the press alone). */
  get active(): boolean {
    return this.gesture !== null;
  }

  /** A press at (px, py); returns whether the plot took it. */
  down(px: number, py: number): boolean {
    const frame = this.host.frame();
    if (this.host.editable()) {
      const handle = nearest(this.host.handles(), (h) => [frame.x(h.point.re), frame.y(h.point.im)], px, py, HIT.handle);
      if (handle) {
        this.host.hover(null);
        this.host.selectHandle(handle);
        this.gesture = { kind: 'handle', handle, x: px, y: py, moved: false };
        return true;
      }
      const tool = this.host.tool();
      if (tool !== 'none') {
        this.gesture = { kind: 'add', tool };
        return true;
      }
    }
    const marker = nearest(this.host.markers(), (m) => [frame.x(m.pole.re), frame.y(m.pole.im)], px, py, HIT.marker);
    if (marker) {
      this.gesture = { kind: 'marker', marker, x: px, y: py, moved: false };
      return true;
    }
    const result = this.host.result();
    const hit = result ? nearestLocusPoint(result, frame, px, py, HIT.branch) : null;
    if (hit) {
      this.gesture = { kind: 'gain', branch: hit.branch };
      this.host.setGain(hit.gain);
      return true;
    }
    if (this.host.editable()) this.host.selectHandle(null);
    return false;
  }

  /** The pointer moved to (px, py), pressed or not. */
  move(px: number, py: number): void {
    const g = this.gesture;
    const frame = this.host.frame();
    const result = this.host.result();
    if (g?.kind === 'handle') {
      if (!g.moved && Math.hypot(px - g.x, py - g.y) < HIT.moved) return;
      g.moved = true;
      this.host.moveHandle(g.handle, { re: frame.x.invert(px), im: frame.y.invert(py) }, false);
      return;
    }
    if (g?.kind === 'marker' && !g.moved && Math.hypot(px - g.x, py - g.y) >= HIT.moved) {
      g.moved = true;
      this.gesture = { kind: 'gain', branch: g.marker.branch };
    }
    const current = this.gesture;
    if (current?.kind === 'gain' && result) {
      const hit = nearestLocusPoint(result, frame, px, py, Infinity, current.branch);
      if (hit) this.host.setGain(hit.gain);
      this.host.hover({ x: px, y: py, branch: current.branch });
      return;
    }
    this.host.hover(current ? null : { x: px, y: py });
  }

  /** The press ended at (px, py). */
  up(px: number, py: number): void {
    const g = this.gesture;
    this.gesture = null;
    if (!g) return;
    const frame = this.host.frame();
    if (g.kind === 'handle' && g.moved) this.host.moveHandle(g.handle, { re: frame.x.invert(px), im: frame.y.invert(py) }, true);
    else if (g.kind === 'marker' && !g.moved) this.host.pickPole(g.marker);
    else if (g.kind === 'add') this.host.addPoint(g.tool, { re: frame.x.invert(px), im: frame.y.invert(py) });
  }

  /** The gesture was interrupted (pointer lost, Escape). */
  cancel(): void {
    this.gesture = null;
  }
}

function nearest<T>(items: readonly T[], at: (item: T) => [number, number], px: number, py: number, within: number): T | null {
  let best: T | null = null;
  let bestDistance = within;
  for (const item of items) {
    const [x, y] = at(item);
    const d = Math.hypot(x - px, y - py);
    if (d <= bestDistance) {
      best = item;
      bestDistance = d;
    }
  }
  return best;
}
