import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { Model, RevisionSummary } from '../api/api-types';
import type { DiffField, FieldDiff } from './conflict-diff';

/** A save refused because someone saved in between (412): what the panel shows. */
export interface ConflictView {
  /** The revision the edits started from. */
  readonly baseRevision: number;
  /** The model as it is now (their revision). */
  readonly theirs: Model;
  /** The revisions saved since the base, newest first. */
  readonly newer: readonly RevisionSummary[];
  /** Where their revision and the edits differ, field by field. */
  readonly diffs: readonly FieldDiff[];
  /** Whether their revisions changed the compensator or the design (which this editor keeps). */
  readonly keptPartsChanged: boolean;
}

/**
 * The conflict panel of the model editor: who saved which revision when and why, what differs between
 * their revision and your edits, and the ways on — save yours on top, load theirs, or keep editing.
 */
@Component({
  selector: 'pwc-conflict-panel',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  templateUrl: './conflict-panel.html',
  styleUrl: './conflict-panel.scss',
  host: { role: 'region', 'aria-labelledby': 'pwc-conflict-title' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConflictPanel {
  readonly conflict = input.required<ConflictView>();
  /** Whether a save is under way (the buttons wait). */
  readonly busy = input(false);
  /** Save the edits as the next revision on top of theirs. */
  readonly saveMine = output<void>();
  /** Drop the edits and load their revision into the form. */
  readonly loadTheirs = output<void>();
  /** Close the panel and go on editing. */
  readonly keepEditing = output<void>();
  /** Copy their value of one field into the form. */
  readonly useTheirs = output<DiffField>();
  /** Copy their values of the fields the edits left alone. */
  readonly takeUntouched = output<void>();

  /** Fields only they changed: taking theirs loses nothing of the edits. */
  protected readonly untouched = computed(() => this.conflict().diffs.filter((d) => d.changedByThem && !d.changedByMe));

  protected who(diff: FieldDiff): string {
    if (diff.changedByMe && diff.changedByThem) return 'changed by both';
    if (diff.changedByMe) return 'changed by you';
    return diff.changedByThem ? 'changed by them' : '';
  }
}
