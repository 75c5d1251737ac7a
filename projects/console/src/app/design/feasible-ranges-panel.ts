import { ChangeDetectionStrategy, Component, computed, input, output, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Schemas } from '../api/api-types';
import { type ApiProblem, problemSummary } from '../problem/api-problem';
import { Caution } from '../safety/caution';
import { formatFigure } from './compensator-rows';
import { type RangeRow, rangeRows, SUGGESTION_RULES } from './feasible-ranges';

/** Where the design request of the workspace stands. */
export interface DesignOutcome {
  /** A request is on its way (the last answer stays shown meanwhile). */
  readonly loading: boolean;
  /** The request the answer belongs to. */
  readonly request: Schemas['DesignRequest'] | null;
  readonly result: Schemas['DesignResult'] | null;
  /** Why the last request failed, else null. */
  readonly problem: ApiProblem | null;
}

/** Nothing asked yet. */
export const NO_DESIGN: DesignOutcome = { loading: false, request: null, result: null, problem: null };

/**
 * The feasible gain ranges the API found for the targets (`POST /design`): each range with what binds at its
 * ends and a suggested gain that a click applies, the gains where the locus crosses the damping lines, and
 * "no gain meets all targets" when there is none — with the safety caution beside every suggestion.
 */
@Component({
  selector: 'pwc-feasible-ranges',
  imports: [MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule, MatTooltipModule, Caution],
  templateUrl: './feasible-ranges-panel.html',
  styleUrl: './feasible-ranges-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FeasibleRangesPanel {
  readonly outcome = input.required<DesignOutcome>();
  /** The loop's current gain (its range is marked). */
  readonly gain = input.required<number>();
  /** The user picked a range: the gain to set. */
  readonly pick = output<number>();

  protected readonly columns = ['from', 'lower', 'to', 'upper', 'suggested'];
  protected readonly rules = SUGGESTION_RULES;
  protected readonly hasTargets = computed(() => !!this.outcome().request?.targets);
  /** Rows depend on the answer, not on the gain (the (0, ∞) suggestion reads the gain when it was asked). */
  protected readonly rows = computed<RangeRow[]>(() => {
    const { request, result } = this.outcome();
    if (!request || !result) return [];
    try {
      return rangeRows(request, result, this.gainAtAnswer(result));
    } catch {
      // the engine accepted the loop, so this only guards the read-out
      return [];
    }
  });
  protected readonly stableText = computed(() => (this.outcome().result?.stableGainRanges ?? []).map((r) => rangeText(r.from, r.to)).join(', '));
  protected readonly lines = computed(() =>
    (this.outcome().result?.dampingLineGains ?? []).map((line) => ({
      zeta: formatFigure(line.dampingRatio, 4),
      gains: line.gains.map((g) => formatFigure(g, 5)).join(', '),
    })),
  );
  protected readonly problemText = computed(() => {
    const problem = this.outcome().problem;
    if (!problem) return null;
    const unplaced = problem.errors.filter((e) => !e.pointer.startsWith('/targets'));
    return unplaced.length ? `${problem.title}: ${unplaced.map((e) => `${e.pointer || 'request'} ${e.detail}`).join('; ')}` : problem.errors.length ? 'The API refused a target: see the field marked in red.' : problemSummary(problem);
  });

  private answered: Schemas['DesignResult'] | null = null;
  private answeredGain = 1;

  /** Whether the current gain lies in this range. */
  protected holdsGain(row: RangeRow): boolean {
    const gain = this.gain();
    return gain > row.from && (row.to === null || gain < row.to);
  }

  protected use(row: RangeRow): void {
    this.pick.emit(row.suggested);
  }

  private gainAtAnswer(result: Schemas['DesignResult']): number {
    if (result !== this.answered) {
      this.answered = result;
      this.answeredGain = untracked(this.gain);
    }
    return this.answeredGain;
  }
}

function rangeText(from: number, to: number | null): string {
  return to === null ? `K > ${formatFigure(from)}` : `${formatFigure(from)} < K < ${formatFigure(to)}`;
}
