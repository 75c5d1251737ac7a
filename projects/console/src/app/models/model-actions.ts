import { inject, Injectable } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Model, ModelInput } from '../api/api-types';
import { toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { modelInputOf } from './model-input';
import { ModelsApi } from './models-api';

/** The longest name and revision comment the API takes (ModelInput). */
const NAME_MAX = 120;
const COMMENT_MAX = 500;

/** How long the "Deleted … Undo" snackbar stays. */
export const UNDO_DURATION_MS = 10_000;

/** The model a row or page acts on: enough to name it. */
export type NamedModel = Pick<Model, 'id' | 'name'>;

/**
 * The body that creates a copy of a model: the same content under "Copy of <name>", with a revision
 * comment saying where it came from (name, revision and id of the original).
 */
export function duplicateInput(model: Model): ModelInput {
  const comment = `Duplicated from “${model.name}”, revision ${model.revision} (model ${model.id}).`;
  return { ...modelInputOf(model, comment.slice(0, COMMENT_MAX)), name: `Copy of ${model.name}`.slice(0, NAME_MAX) };
}

/**
 * The actions the library and the model page share: duplicate (read the current revision, create the
 * copy, go to it), delete after a confirmation with an Undo in the snackbar, and restore.
 */
@Injectable({ providedIn: 'root' })
export class ModelActions {
  private readonly api = inject(ModelsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly notices = inject(Notices);
  private readonly router = inject(Router);

  /** Copies the model's current revision into a new model and opens it; null when the API refused. */
  async duplicate(id: string): Promise<Model | null> {
    try {
      const { model } = await firstValueFrom(this.api.get(id));
      const { model: copy } = await firstValueFrom(this.api.create(duplicateInput(model)));
      this.notices.done(`Created “${copy.name}”`);
      await this.router.navigate(['/models', copy.id]);
      return copy;
    } catch (error) {
      // create() shows its 400s at a form; here there is none, so say it in the snackbar
      const problem = toProblem(error);
      if (problem.status === 400) this.notices.problem(problem);
      return null;
    }
  }

  /**
   * Asks, then soft-deletes the model; the snackbar offers Undo, which restores it and calls `afterUndo`
   * with the restored model. Resolves to whether the model was deleted.
   */
  async remove(model: NamedModel, afterUndo: (restored: Model) => void = () => undefined): Promise<boolean> {
    const confirmed = await confirmAction(this.dialog, {
      title: `Delete “${model.name}”?`,
      lines: ['It leaves the library. Its revisions are kept: you can undo right after, or restore it later from the library with “Show deleted”.'],
      confirm: 'Delete',
      cancel: 'Keep it',
      destructive: true,
    });
    if (!confirmed) return false;
    try {
      await firstValueFrom(this.api.remove(model.id), { defaultValue: undefined });
    } catch {
      return false; // the interceptor has shown the problem
    }
    const snack = this.snackBar.open(`Deleted “${model.name}”`, 'Undo', { duration: UNDO_DURATION_MS });
    snack.onAction().subscribe(() => {
      void this.restore(model).then((restored) => restored && afterUndo(restored));
    });
    return true;
  }

  /** Undoes a soft delete; the restored model, or null when the API refused (shown by the interceptor). */
  async restore(model: NamedModel): Promise<Model | null> {
    try {
      const { model: restored } = await firstValueFrom(this.api.restore(model.id));
      this.notices.done(`Restored “${restored.name}”`);
      return restored;
    } catch {
      return null;
    }
  }
}
