import { booleanAttribute, ChangeDetectionStrategy, Component, computed, input, numberAttribute, ViewEncapsulation } from '@angular/core';
import { GainControl } from '../gain-control/gain-control';
import { LocusPlot } from '../locus-plot/locus-plot';
import { bindLoop } from '../loop/loop-binding';
import type { ElementTheme } from '../loop/loop-element';
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
  host: { '[attr.theme]': 'theme() ?? null' },
})
export class LoopStudio {
  readonly model = input<unknown>();
  readonly modelId = input<string>();
  readonly apiBase = input<string>();
  readonly token = input<string>();
  /** Shared loop key; other elements on the page with the same key follow the studio. */
  readonly loop = input<string>();
  readonly gain = input(Number.NaN, { transform: numberAttribute });
  readonly targets = input<unknown>();
  readonly theme = input<ElementTheme>();
  /** Lets the user add, drag and remove compensator poles and zeros on the plot. */
  readonly editable = input(false, { transform: booleanAttribute });
  /** Heading above the studio (default: the model's name, when it has one). */
  readonly label = input<string>();

  // the children find the studio's loop by key, so a studio without `loop` gets a key of its own
  private readonly ownKey = `pw-studio-${nextStudio++}`;
  protected readonly key = computed(() => this.loop()?.trim() || this.ownKey);
  protected readonly binding = bindLoop({
    loop: this.key,
    model: this.model,
    modelId: this.modelId,
    apiBase: this.apiBase,
    token: this.token,
    gain: this.gain,
    targets: this.targets,
  });
  protected readonly heading = computed(() => this.label() ?? this.binding.state().model()?.name ?? null);
}
