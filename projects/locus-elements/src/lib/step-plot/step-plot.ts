import { ChangeDetectionStrategy, Component, computed, viewChild, ViewEncapsulation, type ElementRef } from '@angular/core';
import { formatFigure } from '../figures/figure-format';
import { elementSize } from '../figures/host-size';
import { LoopElement } from '../loop/loop-element';
import { stepDrawing } from './step-drawing';

/**
 * Closed-loop unit-step response at the loop's current gain, from the loop's shared `closedLoop` result:
 * overshoot, 10–90 % rise and 2 % settling marked, and the envelope of the `targets` (overshoot ceiling,
 * settling band) shaded. Follows its container's size.
 */
@Component({
  selector: 'pwl-step-plot',
  templateUrl: './step-plot.html',
  styleUrls: ['../theme/theme.css', './step-plot.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StepPlot extends LoopElement {
  private readonly canvas = viewChild<ElementRef<HTMLDivElement>>('canvas');
  private readonly size = elementSize(this.canvas, { width: 420, height: 220 });
  protected readonly result = computed(() => this.state().closedLoop());
  protected readonly drawing = computed(() => {
    const result = this.result();
    const step = result?.step;
    if (!result || !step || step.time.length < 2) return null;
    return stepDrawing(step, result.domain === 'z', this.state().targets(), this.size());
  });
  protected readonly message = computed(() => {
    const state = this.state();
    if (state.status() === 'loading') return 'Loading the model…';
    if (state.error()) return state.error();
    if (state.status() === 'idle') return 'No model yet.';
    if (state.closedLoopError()) return state.closedLoopError();
    return this.result() && !this.result()?.step ? 'No step response at K = 0.' : null;
  });
  protected readonly summary = computed(() => {
    const result = this.result();
    const step = result?.step;
    if (!result || !step) return '';
    const head = `Step response at K = ${formatFigure(result.gain)}`;
    if (!result.stable) return `${head}: the closed loop is not stable, the response grows without bound.`;
    return `${head}: final value ${formatFigure(step.finalValue)}, overshoot ${formatFigure(step.overshootPct)} %, rise time ${formatFigure(step.riseTime)} s, settling time ${formatFigure(step.settlingTime)} s.`;
  });
}
