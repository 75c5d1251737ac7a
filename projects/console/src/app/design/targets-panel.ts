import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { DesignTargets } from '../api/api-types';
import { FieldMessagePipe } from '../forms/field-message';
import { formatFigure } from './compensator-rows';
import { dampingFromOvershoot, type DesignForm } from './targets-form';

/**
 * The design targets as a form: minimum damping ratio, maximum 2 % settling time, maximum overshoot,
 * natural-frequency band, and whether only the dominant pair is judged. The form belongs to the workspace
 * (which puts the API's field errors on it); this panel lays it out and says what the targets amount to.
 */
@Component({
  selector: 'pwc-targets-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSlideToggleModule, MatTooltipModule, FieldMessagePipe],
  templateUrl: './targets-panel.html',
  styleUrl: './targets-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TargetsPanel {
  /** The workspace's targets form. */
  readonly form = input.required<DesignForm>();
  /** The targets last applied (valid), for the read-out of what they amount to. */
  readonly applied = input<DesignTargets | null>(null);

  /** What the targets amount to for the engine, in one line (or null when there are none). */
  protected meaning(targets: DesignTargets | null): string | null {
    if (!targets) return null;
    const parts: string[] = [];
    const fromOvershoot = targets.maxOvershootPct !== undefined ? dampingFromOvershoot(targets.maxOvershootPct) : null;
    if (fromOvershoot !== null) parts.push(`overshoot ≤ ${formatFigure(targets.maxOvershootPct as number)} % means ζ ≥ ${formatFigure(fromOvershoot, 3)}`);
    if (targets.minDampingRatio !== undefined && fromOvershoot !== null) {
      parts.push(`the tighter ζ bound (${formatFigure(Math.max(targets.minDampingRatio, fromOvershoot), 3)}) applies`);
    }
    if (targets.maxSettlingTime !== undefined) parts.push(`settling ≤ ${formatFigure(targets.maxSettlingTime)} s means decay rate ζωn ≥ ${formatFigure(4 / targets.maxSettlingTime, 3)} 1/s (Ts ≈ 4/(ζωn))`);
    return parts.length ? `${parts.join('; ')}.` : null;
  }
}
