import { computed, signal } from '@angular/core';
import type { Complex, LocusResult } from '@polewright/locus-core';
import type { ModelEditDetail } from '../loop/host-events';
import type { Compensator, LoopModel } from '../loop/loop-model';
import type { LoopState } from '../loop/loop-state';
import { addedCount, addPoint, handlesOf, movePoint, removePoint, sameHandle, type EditTool, type Handle } from './compensator-points';
import { formatComplex } from './features';

/** What the editor needs from its plot. */
export interface EditorPlot {
  state(): LoopState;
  result(): LocusResult | null;
  /** Plane units within which a click counts as on the real axis (a few pixels). */
  snap(): number;
  /** Sends `pw-model-edit`. */
  emit(detail: ModelEditDetail): void;
}

/**
 * Compensator editing on the plot (`editable`): the add-zero / add-pole tool, the selected point, and the
 * edits themselves. Every edit replaces the loop's model in the shared store (so the locus and every
 * element on the loop follow live); `pw-model-edit` goes out when an edit is complete (added, removed,
 * or a drag released). Edits that would make the loop improper (more zeros than poles) are refused
 * with a notice instead of putting the loop in error.
 */
export class CompensatorEditor {
  /** The add tool in use. */
  readonly tool = signal<EditTool>('none');
  /** The selected compensator point (Delete removes it). */
  readonly selected = signal<{ kind: 'zero' | 'pole'; index: number } | null>(null);
  /** The last refused edit, said in a sentence; null when all went well. */
  readonly notice = signal<string | null>(null);
  /** The model this editor last put in the store (a refit of the view is not wanted for it). */
  readonly ownModel = signal<LoopModel | null>(null);

  /** The compensator of the loop's model (null without one). */
  readonly compensator = computed<Compensator | null>(() => this.plot.state().model()?.compensator ?? null);
  /** Its draggable points. */
  readonly handles = computed<Handle[]>(() => {
    const c = this.compensator();
    return c ? handlesOf(c) : [];
  });
  /** The selected point as a handle. */
  readonly selectedHandle = computed(() => {
    const s = this.selected();
    return s ? sameHandle(this.handles(), s.kind, s.index) : null;
  });

  constructor(private readonly plot: EditorPlot) {}

  /** Turns an add tool on (again: off). */
  toggleTool(tool: 'zero' | 'pole'): void {
    this.tool.update((t) => (t === tool ? 'none' : tool));
    this.notice.set(null);
  }

  /** Selects a compensator point, or none. */
  select(handle: Handle | null): void {
    this.selected.set(handle ? { kind: handle.kind, index: handle.index } : null);
  }

  /** Adds a zero or pole (a conjugate pair off the real axis) at a plane point. */
  add(kind: 'zero' | 'pole', at: Complex): void {
    const snap = this.plot.snap();
    if (kind === 'zero' && !this.roomForZeros(addedCount(at, snap))) {
      this.notice.set('No zero added: the loop would have more zeros than poles. Add a pole first.');
      return;
    }
    const next = addPoint(this.compensator(), kind, at, snap);
    const list = kind === 'zero' ? next.zeros : next.poles;
    this.commit(next, true);
    this.selected.set({ kind, index: list.length - (Math.abs(at.im) <= snap ? 1 : 2) });
  }

  /** Moves a point (its partner follows); `final` when the drag is released. */
  move(handle: Handle, to: Complex, final: boolean): void {
    const c = this.compensator();
    if (!c) return;
    this.commit(movePoint(c, handle, to, this.plot.snap() / 3), final);
  }

  /** Removes the selected point (and its conjugate partner). */
  removeSelected(): void {
    const c = this.compensator();
    const handle = this.selectedHandle();
    if (!c || !handle) return;
    if (handle.kind === 'pole' && !this.roomForZeros(-(handle.partner === null ? 1 : 2))) {
      this.notice.set(`Pole at ${formatComplex(handle.point)} kept: without it the loop would have more zeros than poles. Remove a zero first.`);
      return;
    }
    this.selected.set(null);
    this.commit(removePoint(c, handle), true);
  }

  /** Drops the tool and the selection. */
  cancel(): void {
    this.tool.set('none');
    this.selected.set(null);
    this.notice.set(null);
  }

  /** The open-loop poles and zeros of the plant alone (the compensator's are drawn as handles). */
  plantPart(openLoop: { poles: readonly Complex[]; zeros: readonly Complex[] }): { poles: Complex[]; zeros: Complex[] } {
    const c = this.compensator();
    if (!c) return { poles: [...openLoop.poles], zeros: [...openLoop.zeros] };
    return { poles: without(openLoop.poles, c.poles), zeros: without(openLoop.zeros, c.zeros) };
  }

  // whether the loop stays proper with `extra` more zeros than now (negative: fewer poles)
  private roomForZeros(extra: number): boolean {
    const result = this.plot.result();
    if (!result) return false;
    const zeros = result.normalizedPlant.numerator.length - 1;
    const poles = result.normalizedPlant.denominator.length - 1;
    return extra > 0 ? zeros + extra <= poles : zeros <= poles + extra;
  }

  private commit(compensator: Compensator | null, final: boolean): void {
    const state = this.plot.state();
    const model = state.model();
    if (!model) return;
    const next: LoopModel = { ...model, compensator };
    this.notice.set(null);
    this.ownModel.set(next);
    state.setModel(next);
    if (final) this.plot.emit({ plant: next.plant, compensator });
  }
}

// removes from `all` one value near each of `part` (the loop's poles are the plant's and the compensator's)
function without(all: readonly Complex[], part: readonly Complex[]): Complex[] {
  const left = [...all];
  for (const p of part) {
    let best = -1;
    let bestDistance = 1e-6 * Math.max(1, Math.hypot(p.re, p.im));
    left.forEach((q, i) => {
      const d = Math.hypot(q.re - p.re, q.im - p.im);
      if (d <= bestDistance) {
        best = i;
        bestDistance = d;
      }
    });
    if (best >= 0) left.splice(best, 1);
  }
  return left;
}
