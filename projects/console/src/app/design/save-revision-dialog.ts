import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { type AbstractControl, FormControl, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom, forkJoin } from 'rxjs';
import type { RevisionSummary } from '../api/api-types';
import { FieldMessagePipe } from '../forms/field-message';
import { ModelsApi, type TaggedModel } from '../models/models-api';
import { type ApiProblem, toProblem } from '../problem/api-problem';
import { Caution } from '../safety/caution';
import { formatFigure } from './compensator-rows';
import { compensatorText, type DesignEdits, revisionBody, revisionChanges, samePlant, targetsText } from './save-revision';

/** What the save dialog is given: the model as loaded (with its ETag) and the edits to save on it. */
export interface SaveRevisionData {
  readonly loaded: TaggedModel;
  readonly edits: DesignEdits;
}

/** How the dialog ended: saved, "load theirs" after a conflict, refused fields for the workspace, or cancelled (undefined). */
export type SaveRevisionResult = { readonly kind: 'saved'; readonly saved: TaggedModel } | { readonly kind: 'reload' } | { readonly kind: 'invalid'; readonly problem: ApiProblem };

/** Someone else's revision that came first. */
interface Conflict {
  readonly latest: TaggedModel;
  readonly summary: RevisionSummary | null;
  readonly plantChanged: boolean;
  /** What their revision changed, in words. */
  readonly changed: readonly string[];
}

/**
 * "Save as new revision": shows what will be saved, asks for the revision comment (required) and saves with
 * `If-Match`. On 412 it says who saved which revision meanwhile and offers to save on top of it (their name,
 * tags and plant kept, with a warning when the plant changed) or to load theirs; nothing of the workspace
 * is lost either way until the person chooses. Field errors other than the comment's go back to the workspace.
 */
@Component({
  selector: 'pwc-save-revision-dialog',
  imports: [ReactiveFormsModule, DatePipe, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, FieldMessagePipe, Caution],
  templateUrl: './save-revision-dialog.html',
  styleUrl: './save-revision-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveRevisionDialog {
  private readonly api = inject(ModelsApi);
  private readonly ref = inject<MatDialogRef<SaveRevisionDialog, SaveRevisionResult>>(MatDialogRef);
  protected readonly data = inject<SaveRevisionData>(MAT_DIALOG_DATA);

  protected readonly comment = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(500), notBlank] });
  protected readonly saving = signal(false);
  protected readonly conflict = signal<Conflict | null>(null);
  protected readonly compensatorText = compensatorText(this.data.edits.compensator);
  protected readonly targetsText = targetsText(this.data.edits.targets);
  protected readonly gainText = formatFigure(this.data.edits.gain, 6);

  /** Saves on top of the revision loaded (or, after a conflict, on top of theirs). */
  async save(): Promise<void> {
    this.comment.markAsTouched();
    if (this.comment.invalid || this.saving()) return;
    const onTop = this.conflict()?.latest ?? this.data.loaded;
    this.saving.set(true);
    try {
      const saved = await firstValueFrom(this.api.update(onTop.model.id, revisionBody(onTop.model, this.data.edits, this.comment.value), onTop.etag));
      this.ref.close({ kind: 'saved', saved });
    } catch (error) {
      await this.refused(toProblem(error));
    } finally {
      this.saving.set(false);
    }
  }

  /** Drops the edits and loads the revision that came first. */
  loadTheirs(): void {
    this.ref.close({ kind: 'reload' });
  }

  protected byline(conflict: Conflict): string {
    const who = conflict.summary?.author?.name ?? conflict.latest.model.updatedBy?.name ?? 'Someone';
    return `${who} saved revision ${conflict.latest.model.revision}`;
  }

  private async refused(problem: ApiProblem): Promise<void> {
    if (problem.status === 412) {
      const id = this.data.loaded.model.id;
      try {
        const [latest, revisions] = await firstValueFrom(forkJoin([this.api.get(id), this.api.revisions(id)]));
        this.conflict.set({
          latest,
          summary: revisions.find((r) => r.revision === latest.model.revision) ?? null,
          plantChanged: !samePlant(latest.model, this.data.loaded.model),
          changed: revisionChanges(this.data.loaded.model, latest.model),
        });
      } catch {
        // the interceptor said why the latest revision could not be read; the dialog stays as it was
      }
      return;
    }
    if (problem.status !== 400) return; // shown by the interceptor (snackbar); the dialog stays open
    const onComment = problem.errors.filter((e) => e.pointer === '/comment');
    for (const e of onComment) {
      this.comment.setErrors({ server: e.detail });
      this.comment.markAsTouched();
    }
    if (onComment.length < problem.errors.length || problem.errors.length === 0) this.ref.close({ kind: 'invalid', problem });
  }
}

function notBlank(control: AbstractControl): ValidationErrors | null {
  const value = control.value as string;
  return value && value.trim() === '' ? { blank: { message: 'Say what changed (not only spaces).' } } : null;
}
