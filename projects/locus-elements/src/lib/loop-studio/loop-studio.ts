import { booleanAttribute, ChangeDetectionStrategy, Component, computed, input, ViewEncapsulation } from '@angular/core';
import { GainControl } from '../gain-control/gain-control';
import { LocusPlot } from '../locus-plot/locus-plot';
import { LoopElement } from '../loop/loop-element';
import { PoleTable } from '../pole-table/pole-table';
import { StabilitySummary } from '../stability-summary/stability-summary';
import { StepPlot } from '../step-plot/step-plot';

let nextStudio = 1;

/**
 * The five elements laid out together on one loop for the common case: the locus plot with the gain
 * control and the stability summary beside it, the step response and the pole table below; one column on
 * narrow containers. Takes the same attributes as each element; without `loop` it uses a loop of its own.
 */
@Component({
  selector: 'pwl-loop-studio',
  imports: [LocusPlot, GainControl, StepPlot, PoleTable, StabilitySummary],
  templateUrl: './loop-studio.html',
  styleUrls: ['../theme/theme.css', './loop-studio.css'],
  encapsulation: ViewEncapsulation.ShadowDom,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoopStudio extends LoopElement {
  /** Lets the user add, drag and remove compensator poles and zeros on the plot. */
  readonly editable = input(false, { transform: booleanAttribute });
  /** Heading above the studio (default: the model's name, when it has one). */
  readonly label = input<string>();

  // the children find the studio's loop by key, so a studio without `loop` gets a key of its own; other
  // elements on the page with the same `loop` follow the studio
  private readonly ownKey = `pw-studio-${nextStudio++}`;
  protected readonly key = computed(() => this.binding.loopKey() as string);
  protected readonly heading = computed(() => this.label() ?? this.state().model()?.name ?? null);

  protected override loopKey(): string {
    return this.loop()?.trim() || this.ownKey;
  }
}
