import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { LocusPlot } from '@polewright/elements';
import type { Revision } from '../api/api-types';
import { gainText } from '../models/loop-format';
import { Caution } from '../safety/caution';
import type { FieldGroup } from './content-fields';
import { type DiffRow, diffRows, jsonDiff } from './revision-diff-rows';

/** The rows of one section of the comparison. */
interface DiffGroup {
  readonly name: FieldGroup;
  readonly rows: readonly DiffRow[];
}

/** One side's locus: the revision's loop at its design gain. */
function plotOf(revision: Revision): { model: { plant: Revision['plant']; compensator: Revision['compensator'] }; gain: number; targets: Revision['design']['targets']; caption: string } {
  return {
    model: { plant: revision.plant, compensator: revision.compensator },
    gain: revision.design.gain ?? Number.NaN,
    targets: revision.design.targets,
    caption: `Revision ${revision.revision} at K = ${gainText(revision.design.gain)}`,
  };
}

/**
 * Two revisions side by side: every field of their content with the changed ones highlighted (words
 * and tags marked where they differ), the root locus of each at its own design gain, and the stored
 * plant and compensator compared line by line.
 */
@Component({
  selector: 'pwc-revision-diff',
  imports: [DatePipe, MatSlideToggleModule, MatExpansionModule, LocusPlot, Caution],
  templateUrl: './revision-diff.html',
  styleUrl: './revision-diff.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionDiff {
  /** The revision on the left. */
  readonly before = input.required<Revision>();
  /** The revision on the right. */
  readonly after = input.required<Revision>();

  protected readonly onlyChanged = signal(false);
  protected readonly rows = computed(() => diffRows(this.before(), this.after()));
  protected readonly changedCount = computed(() => this.rows().filter((r) => r.changed).length);
  protected readonly groups = computed<DiffGroup[]>(() => {
    const shown = this.onlyChanged() ? this.rows().filter((r) => r.changed) : this.rows();
    const groups: DiffGroup[] = [];
    for (const row of shown) {
      const last = groups.at(-1);
      if (last?.name === row.group) (last.rows as DiffRow[]).push(row);
      else groups.push({ name: row.group, rows: [row] });
    }
    return groups;
  });
  protected readonly json = computed(() => jsonDiff(this.before(), this.after()));
  protected readonly sameLoop = computed(() => this.before().contentHash === this.after().contentHash);
  protected readonly left = computed(() => plotOf(this.before()));
  protected readonly right = computed(() => plotOf(this.after()));
}
