import { ChangeDetectionStrategy, Component, computed, input, numberAttribute, signal, ViewEncapsulation } from '@angular/core';
import { formatFigure } from '../figures/figure-format';
import { LoopElement } from '../loop/loop-element';
import { gainSpanOf, parseGain, TRACK_STEPS, trackScale, trackSegments } from './gain-track';

/**
 * Gain control of a loop: a logarithmic slider and a number field kept in step, with the stable and
 * unstable stretches of gain drawn on the slider's track. Moving either sets the gain of every element
 * on the same `loop` and sends `pw-gain-change` `{ gain, loop }`. A typed value that is not a positive
 * number is refused with a message at the field; the gain stays as it was.
 */
@Component({
  selector: 'pwl-gain-control',
  templateUrl: './gain-control.html',
  styleUrls: ['../theme/theme.css', './gain-control.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GainControl extends LoopElement {
  /** Lowest gain on the slider (automatic when absent). */
  readonly min = input(Number.NaN, { transform: numberAttribute });
  /** Highest gain on the slider (automatic when absent). */
  readonly max = input(Number.NaN, { transform: numberAttribute });
  /** Text of the label, default "Gain K". */
  readonly label = input('Gain K');

  protected readonly steps = TRACK_STEPS;
  protected readonly draft = signal<string | null>(null);
  protected readonly fieldError = signal<string | null>(null);
  protected readonly currentGain = computed(() => this.state().gain());
  protected readonly locus = computed(() => this.state().locus());
  protected readonly ready = computed(() => this.locus() !== null);
  protected readonly message = computed(() => {
    const state = this.state();
    if (state.status() === 'loading') return 'Loading the model…';
    return state.error() ?? (state.status() === 'idle' ? 'No model yet.' : null);
  });

  // equal spans keep the same value, so a drag inside the span does not rebuild the scale, segments and ticks
  private readonly span = computed(() => gainSpanOf(this.locus(), this.currentGainAtSpanChange(), this.min(), this.max()), {
    equal: (a, b) => a.lo === b.lo && a.hi === b.hi,
  });
  private readonly scale = computed(() => trackScale(this.span().lo, this.span().hi));
  protected readonly position = computed(() => Math.round(this.scale()(this.currentGain())));
  protected readonly segments = computed(() => trackSegments(this.locus()?.stableGainRanges ?? [], this.span().lo, this.span().hi));
  protected readonly limitTicks = computed(() => {
    const scale = this.scale();
    const { lo, hi } = this.span();
    const gains = (this.locus()?.crossings ?? []).map((c) => c.gain).filter((g) => g > lo && g < hi);
    return [...new Set(gains.map((g) => Number(g.toPrecision(8))))].map((gain) => ({ gain, left: (scale(gain) / TRACK_STEPS) * 100, label: `K = ${formatFigure(gain)}` }));
  });
  protected readonly ends = computed(() => ({ lo: formatFigure(this.span().lo), hi: formatFigure(this.span().hi) }));
  protected readonly fieldText = computed(() => this.draft() ?? formatInput(this.currentGain()));
  protected readonly valueText = computed(() => {
    const gain = this.currentGain();
    const ranges = this.locus()?.stableGainRanges ?? [];
    const stable = ranges.some((r) => r.from < gain && (r.to === null || gain < r.to));
    return `K = ${formatFigure(gain)}, ${stable ? 'stable' : 'not stable'}`;
  });

  // the span follows the gain only when it leaves the span, so that a drag does not move its own track
  private spanGain = Number.NaN;
  private currentGainAtSpanChange(): number {
    const gain = this.currentGain();
    const { lo, hi } = gainSpanOf(this.locus(), Number.isFinite(this.spanGain) ? this.spanGain : gain, this.min(), this.max());
    if (!Number.isFinite(this.spanGain) || gain < lo || gain > hi) this.spanGain = gain;
    return this.spanGain;
  }

  /** Sets the gain from a slider position. */
  protected slide(event: Event): void {
    const position = Number((event.target as HTMLInputElement).value);
    const gain = Number(this.scale().invert(position).toPrecision(6));
    this.fieldError.set(null);
    this.draft.set(null);
    this.binding.setGainByUser(gain);
  }

  /** Applies the typed gain, or shows why it is refused and keeps the gain. */
  protected commit(): void {
    const text = this.draft();
    if (text === null) return;
    const read = parseGain(text);
    if ('error' in read) {
      this.fieldError.set(read.error);
      return;
    }
    this.fieldError.set(null);
    this.draft.set(null);
    this.binding.setGainByUser(read.gain);
  }

  /** Drops what was typed and shows the current gain again. */
  protected revert(): void {
    this.draft.set(null);
    this.fieldError.set(null);
  }

  protected edit(event: Event): void {
    this.draft.set((event.target as HTMLInputElement).value);
  }
}

function formatInput(gain: number): string {
  return Number.isFinite(gain) ? String(Number(gain.toPrecision(6))) : '';
}
