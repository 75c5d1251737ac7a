import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { GainRange } from '@polewright/locus-core';
import { Caution } from '../safety/caution';
import { formatFigure } from './compensator-rows';
import { nearestLimit } from './gain-standing';

/**
 * The verdict at the current gain, large: stable or not (the engine's closed loop at this K), the factor
 * and dB to the nearest stability limit (from the engine's exact stable ranges), whether the gain meets the
 * targets (the API's feasible ranges), and the safety caution beside it.
 */
@Component({
  selector: 'pwc-gain-verdict',
  imports: [MatIconModule, Caution],
  template: `
    <div class="verdict" [class.good]="stable() === true" [class.bad]="stable() === false" role="status" aria-live="polite">
      <mat-icon aria-hidden="true">{{ stable() === true ? 'check_circle' : stable() === false ? 'cancel' : 'hourglass_empty' }}</mat-icon>
      <div class="text">
        <p class="headline">{{ headline() }}</p>
        @if (marginText(); as text) {
          <p class="margin">{{ text }}</p>
        }
        @if (meetsTargets() !== null) {
          <p class="targets" [class.miss]="!meetsTargets()">{{ meetsTargets() ? 'Meets the design targets at this gain.' : 'Misses the design targets at this gain.' }}</p>
        }
      </div>
    </div>
    <pwc-caution [compact]="true" />
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    .verdict {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 12px 16px;
      border-radius: 12px;
      background: var(--mat-sys-surface-container-high);
    }
    .verdict.good {
      background: #d7f0dc;
      color: #0f5223;
    }
    .verdict.bad {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    mat-icon {
      flex: none;
      font-size: 32px;
      width: 32px;
      height: 32px;
    }
    p {
      margin: 0;
    }
    .headline {
      font: var(--mat-sys-title-large);
    }
    .margin {
      margin-top: 2px;
      font: var(--mat-sys-body-large);
      font-variant-numeric: tabular-nums;
    }
    .targets {
      margin-top: 4px;
      font: var(--mat-sys-label-large);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GainVerdict {
  /** The loop gain K on screen. */
  readonly gain = input.required<number>();
  /** The engine's closed-loop verdict at that gain (null while there is none). */
  readonly stable = input<boolean | null>(null);
  /** The engine's exact stable ranges of K > 0. */
  readonly ranges = input<readonly GainRange[]>([]);
  /** Whether the gain lies in a feasible range (null: no targets, or no answer yet). */
  readonly meetsTargets = input<boolean | null>(null);

  protected readonly headline = computed(() => {
    const k = formatFigure(this.gain(), 5);
    const stable = this.stable();
    if (stable === null) return `K = ${k}`;
    return stable ? `Stable at K = ${k}` : `Not stable at K = ${k}`;
  });
  protected readonly marginText = computed(() => {
    if (this.stable() === null) return null;
    const limit = nearestLimit(this.ranges(), this.gain());
    const ranges = this.ranges();
    if (!limit) {
      if (this.stable()) return ranges.length ? 'No stability limit for any positive gain.' : null;
      return 'No positive gain makes this loop stable.';
    }
    const factor = `×${formatFigure(limit.ratio, 3)} (${formatFigure(limit.decibels, 3)} dB)`;
    if (this.stable()) {
      return limit.direction === 'up'
        ? `Gain margin ${factor}: unstable from K = ${formatFigure(limit.gain, 5)} up.`
        : `Lower gain margin ${factor}: unstable below K = ${formatFigure(limit.gain, 5)}.`;
    }
    return limit.direction === 'up' ? `Stable from K = ${formatFigure(limit.gain, 5)}, ${factor} higher.` : `Stable below K = ${formatFigure(limit.gain, 5)}, ${factor} lower.`;
  });
}
