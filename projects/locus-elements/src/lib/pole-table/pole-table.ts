import { ChangeDetectionStrategy, Component, computed, ViewEncapsulation } from '@angular/core';
import { formatFigure } from '../figures/figure-format';
import { LoopElement } from '../loop/loop-element';
import { poleRows } from './pole-rows';

/**
 * The closed-loop poles at the loop's current gain as a table: value, damping ratio ζ, natural
 * frequency ωn, time constant τ, and whether the pole decays. Conjugate pairs share one row.
 */
@Component({
  selector: 'pwl-pole-table',
  templateUrl: './pole-table.html',
  styleUrls: ['../theme/theme.css', './pole-table.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PoleTable extends LoopElement {
  protected readonly result = computed(() => this.state().closedLoop());
  protected readonly rows = computed(() => poleRows(this.result()?.poles ?? []));
  protected readonly plane = computed(() => (this.result()?.domain === 'z' ? 'z' : 's'));
  protected readonly caption = computed(() => {
    const result = this.result();
    if (!result) return 'Closed-loop poles';
    return `Closed-loop poles at K = ${formatFigure(result.gain)} — ${result.stable ? 'stable' : 'not stable'}`;
  });
  protected readonly message = computed(() => {
    const state = this.state();
    if (state.status() === 'loading') return 'Loading the model…';
    if (state.error()) return state.error();
    if (state.status() === 'idle') return 'No model yet.';
    return state.closedLoopError();
  });
  protected readonly figure = formatFigure;
}
