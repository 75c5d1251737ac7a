import { ChangeDetectionStrategy, Component, computed, ViewEncapsulation } from '@angular/core';
import { CAUTION, type GainRange } from '@polewright/locus-core';
import { formatFigure } from '../figures/figure-format';
import { LoopElement } from '../loop/loop-element';
import { crossingItems } from './crossing-list';
import { gainMargins, type GainLimit } from './gain-margins';

/**
 * Stability of the loop for K > 0: the exact stable gain ranges, the gains at which poles cross the
 * stability boundary, how far the current gain is from the nearest limit (as a factor and in dB), and
 * the caution that goes with every stability statement.
 */
@Component({
  selector: 'pwl-stability-summary',
  templateUrl: './stability-summary.html',
  styleUrls: ['../theme/theme.css', './stability-summary.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StabilitySummary extends LoopElement {
  protected readonly caution = CAUTION;
  protected readonly locus = computed(() => this.state().locus());
  protected readonly currentGain = computed(() => this.state().gain());
  protected readonly ranges = computed(() => (this.locus()?.stableGainRanges ?? []).map((r) => ({ range: r, text: rangeText(r) })));
  protected readonly crossings = computed(() => {
    const result = this.locus();
    return result ? crossingItems(result.crossings, result.domain) : [];
  });
  protected readonly margins = computed(() => gainMargins(this.locus()?.stableGainRanges ?? [], this.currentGain()));
  protected readonly limits = computed(() => {
    const margins = this.margins();
    return margins.limits.map((l) => ({ text: limitText(l, margins.isStable), nearest: l === margins.nearest }));
  });
  protected readonly verdict = computed(() => {
    const gain = this.currentGain();
    if (!(gain > 0)) return `K = ${formatFigure(gain)} is not a positive gain; this summary covers K > 0.`;
    return `At K = ${formatFigure(gain)} the closed loop is ${this.margins().isStable ? 'stable' : 'not stable'}.`;
  });
  protected readonly conditional = computed(() => this.ranges().some((r) => r.range.from > 0));
  protected readonly message = computed(() => {
    const state = this.state();
    if (state.status() === 'loading') return 'Loading the model…';
    if (state.error()) return state.error();
    return state.status() === 'idle' ? 'No model yet.' : null;
  });
}

function rangeText(range: GainRange): string {
  const from = range.from === 0 ? '0' : formatFigure(range.from);
  return range.to === null ? `K > ${from}` : `${from} < K < ${formatFigure(range.to)}`;
}

function limitText(limit: GainLimit, isStable: boolean): string {
  const factor = `×${formatFigure(limit.ratio)}`;
  const db = `${formatFigure(limit.decibels)} dB`;
  if (isStable) {
    return limit.direction === 'up'
      ? `Gain margin ${factor} (${db}): instability at K = ${formatFigure(limit.gain)} if the gain rises that much.`
      : `Lower gain margin ${factor} (${db}): instability at K = ${formatFigure(limit.gain)} if the gain falls that much.`;
  }
  return limit.direction === 'up'
    ? `Stable from K = ${formatFigure(limit.gain)}, ${factor} (${db}) higher.`
    : `Stable below K = ${formatFigure(limit.gain)}, ${factor} (${db}) lower.`;
}
