import { formatDate } from '@angular/common';
import { afterNextRender, ChangeDetectionStrategy, Component, computed, effect, ElementRef, inject, Injector, input, LOCALE_ID, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { LocusPlot, StabilitySummary } from '@polewright/elements';
import type { Compensator, FieldIssue, Warning } from '@polewright/locus-core';
import { debounceTime, firstValueFrom, Subject } from 'rxjs';
import type { Model, ModelInput, Plant } from '../api/api-types';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { PageHeader } from '../layout/page-header';
import { ModelsApi, type TaggedModel } from '../models/models-api';
import { type FieldProblem, problemSummary, toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { handles } from '../problem/problem-context';
import { fieldDiffs, type DiffField } from './conflict-diff';
import { ConflictPanel, type ConflictView } from './conflict-panel';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { copyField, editorForm, type EditorValue, editorValueOf, fillForm, formValueOf, LIMITS, syncEnabled } from './editor-form';
import { clearEngineErrors, editorLocator, engineVerdict, hasOwnErrors, placeEngineIssues } from './engine-check';
import { LiveErrors } from './live-errors';
import { PlantSection } from './plant-section';
import { emptyPlantFields, type PlantFields, plantOf } from './plant-body';
import { TagField } from './tag-field';
import type { LeaveCheck } from '../confirm/unsaved-changes';

/** The comment of a new model's first revision when none is typed. */
export const FIRST_COMMENT = 'First revision';

/** What the preview draws: the plant with the compensator the save keeps. */
interface PreviewModel {
  readonly plant: Plant;
  readonly compensator: Compensator | null;
}

/** A problem summary above the form: a sentence and the errors no field could take. */
interface Summary {
  readonly title: string;
  readonly items: readonly FieldProblem[];
}

let nextEditor = 1;

/**
 * The model editor (`/models/new`, `/models/:id/edit`): name, description, tags, the plant in one of three
 * forms with its time base, and the revision comment. The engine checks the plant as you type (the very
 * function the API runs, so the messages agree) and a root-locus preview follows it. Saving sends the
 * revision it was loaded from as `If-Match`; when someone saved in between, a conflict panel shows their
 * revision against the edits, which stay in the form.
 */
@Component({
  selector: 'pwc-model-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    FieldMessagePipe,
    PageHeader,
    LocusPlot,
    StabilitySummary,
    PlantSection,
    TagField,
    ConflictPanel,
  ],
  templateUrl: './model-editor.html',
  styleUrl: './model-editor.scss',
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
  providers: [{ provide: ErrorStateMatcher, useClass: LiveErrors }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelEditor implements LeaveCheck {
  private readonly api = inject(ModelsApi);
  private readonly notices = inject(Notices);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly injector = inject(Injector);
  private readonly locale = inject(LOCALE_ID);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** The model's id (route parameter); absent for a new model. */
  readonly id = input<string>();

  protected readonly form = editorForm();
  protected readonly limits = LIMITS;
  /** Bumped on every change of the form, so that OnPush views re-read controls and their errors. */
  protected readonly tick = signal(0);
  /** The model as loaded (the revision the edits start from), with its ETag. */
  protected readonly base = signal<TaggedModel | null>(null);
  protected readonly status = signal<'loading' | 'ready' | 'failed'>('ready');
  protected readonly loadFailure = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly summary = signal<Summary | null>(null);
  /** The engine's findings no field takes (the whole plant, the loop with its compensator). */
  protected readonly engineProblems = signal<readonly FieldIssue[]>([]);
  protected readonly warnings = signal<readonly Warning[]>([]);
  protected readonly preview = signal<PreviewModel | null>(null);
  /** Whether the plant as typed has an error (the preview then shows the last valid one). */
  protected readonly previewStale = signal(false);
  protected readonly conflict = signal<{ theirs: TaggedModel; newer: ConflictView['newer'] } | null>(null);
  protected readonly conflictOpen = signal(false);
  protected readonly tagSuggestions = signal<readonly string[]>([]);
  protected readonly loopKey = `pwc-editor-${nextEditor++}`;

  protected readonly isEdit = computed(() => !!this.id());
  protected readonly heading = computed(() => (this.isEdit() ? `Edit ${this.base()?.model.name ?? 'model'}` : 'New model'));
  protected readonly subtitle = computed(() => {
    const model = this.base()?.model;
    if (!model) return 'Describe the plant; the engine checks it as you type and the preview draws its root locus.';
    return `Revision ${model.revision}, saved ${formatDate(model.updatedAt, 'medium', this.locale)}${model.updatedBy ? ` by ${model.updatedBy.name}` : ''}. Saving makes revision ${model.revision + 1}.`;
  });
  /** The compensator and design a save keeps: theirs once a conflict is known (the editor never changes them). */
  protected readonly kept = computed<Model | null>(() => this.conflict()?.theirs.model ?? this.base()?.model ?? null);
  protected readonly savedGain = computed(() => this.kept()?.design.gain ?? null);
  protected readonly previewGain = computed(() => this.savedGain() ?? Number.NaN);
  protected readonly previewTargets = computed(() => this.kept()?.design.targets ?? undefined);
  protected readonly conflictView = computed<ConflictView | null>(() => {
    this.tick();
    const conflict = this.conflict();
    const base = this.base();
    if (!conflict || !base) return null;
    const theirs = conflict.theirs.model;
    return {
      baseRevision: base.model.revision,
      theirs,
      newer: conflict.newer,
      diffs: fieldDiffs(editorValueOf(base.model), editorValueOf(theirs), formValueOf(this.form)),
      keptPartsChanged: JSON.stringify([theirs.compensator, theirs.design]) !== JSON.stringify([base.model.compensator, base.model.design]),
    };
  });

  /** What the form held when loaded (or last saved), to tell whether there is unsaved work. */
  private baseline = '';
  private left = false;
  private readonly previews = new Subject<PreviewModel | null>();

  constructor() {
    this.form.events.pipe(takeUntilDestroyed()).subscribe(() => this.tick.update((n) => n + 1));
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.check());
    // the preview follows the typing once it pauses (~300 ms); field messages follow every keystroke
    this.previews.pipe(debounceTime(300), takeUntilDestroyed()).subscribe((model) => this.showPreview(model));
    effect(() => {
      const id = this.id();
      untracked(() => void this.start(id));
    });
    this.api
      .tags()
      .pipe(takeUntilDestroyed())
      .subscribe({ next: (tags) => this.tagSuggestions.set(tags.map((t) => t.tag)), error: () => undefined });
  }

  /** Saves the form: a new model (POST) or the next revision on top of the loaded one (PUT with If-Match). */
  async save(): Promise<void> {
    await this.send(this.base()?.etag);
  }

  /** Conflict: saves the edits as the next revision on top of theirs (their revision stays in the history). */
  async saveMineOnTop(): Promise<void> {
    const theirs = this.conflict()?.theirs;
    if (theirs) await this.send(theirs.etag);
  }

  /** Conflict: drops the edits and loads their revision into the form. */
  loadTheirs(): void {
    const theirs = this.conflict()?.theirs;
    if (!theirs) return;
    this.conflict.set(null);
    this.conflictOpen.set(false);
    this.adopt(theirs);
  }

  /** Conflict: closes the panel; the next save asks again. */
  keepEditing(): void {
    this.conflictOpen.set(false);
  }

  /** Conflict: copies their value of one field into the form. */
  useTheirs(field: DiffField): void {
    const theirs = this.conflict()?.theirs;
    if (theirs) copyField(this.form, field, editorValueOf(theirs.model));
  }

  /** Conflict: copies their values of every field the edits left alone. */
  takeUntouched(): void {
    const view = this.conflictView();
    if (!view) return;
    const theirs = editorValueOf(view.theirs);
    for (const diff of view.diffs) if (diff.changedByThem && !diff.changedByMe) copyField(this.form, diff.field, theirs);
  }

  /** Whether the form holds work that is not saved. */
  hasUnsavedChanges(): boolean {
    return !this.left && this.status() === 'ready' && this.snapshot() !== this.baseline;
  }

  /** Route guard hook: asks before leaving with unsaved changes. */
  async canLeave(): Promise<boolean> {
    if (!this.hasUnsavedChanges()) return true;
    return confirmAction(this.dialog, {
      title: 'Leave without saving?',
      lines: ['Your changes to this model are not saved. Leaving the editor drops them.'],
      confirm: 'Leave and drop changes',
      cancel: 'Stay and keep editing',
    });
  }

  /** Closing or reloading the tab with unsaved changes: the browser asks. */
  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (!this.hasUnsavedChanges()) return;
    event.preventDefault();
    // older browsers need a return value to ask
    event.returnValue = '';
  }

  /** Opens the conflict panel again after "keep editing". */
  protected reviewConflict(): void {
    this.conflictOpen.set(true);
  }

  private async start(id: string | undefined): Promise<void> {
    this.conflict.set(null);
    this.summary.set(null);
    if (!id) {
      this.base.set(null);
      fillForm(this.form, { name: '', description: '', tags: [], plant: emptyPlantFields() });
      this.form.controls.comment.setValue(FIRST_COMMENT, { emitEvent: false });
      this.form.controls.comment.setValidators([Validators.maxLength(LIMITS.comment)]);
      this.settle();
      return;
    }
    this.status.set('loading');
    try {
      const tagged = await firstValueFrom(this.api.get(id, { context: handles(404) }));
      this.form.controls.comment.setValidators([Validators.required, Validators.maxLength(LIMITS.comment)]);
      this.status.set('ready');
      this.adopt(tagged);
    } catch (error) {
      const problem = toProblem(error);
      this.loadFailure.set(problem.status === 404 ? 'There is no such model, or it was deleted.' : problemSummary(problem));
      this.status.set('failed');
    }
  }

  /** Takes a model as the revision to edit from: form filled, baseline set, preview drawn at once. */
  private adopt(tagged: TaggedModel): void {
    this.base.set(tagged);
    fillForm(this.form, tagged.model);
    this.settle();
  }

  private settle(): void {
    this.form.controls.comment.updateValueAndValidity({ emitEvent: false });
    this.showPreview(this.check());
    this.baseline = this.snapshot();
  }

  private snapshot(): string {
    return JSON.stringify([formValueOf(this.form), this.form.controls.comment.value]);
  }

  /**
   * The engine's live check: clears its previous messages, and when the plant passes the form's own
   * validators, runs the same checks as the API and puts each issue at its field. Queues the plant for the
   * preview when it is valid. Returns that plant (null when it has an error).
   */
  private check(): PreviewModel | null {
    const plantGroup = this.form.controls.plant;
    syncEnabled(plantGroup);
    clearEngineErrors(plantGroup);
    let model: PreviewModel | null = null;
    let unplaced: FieldIssue[] = [];
    let warnings: readonly Warning[] = [];
    const plant = hasOwnErrors(plantGroup) ? null : plantOf(plantGroup.getRawValue() as PlantFields);
    if (plant !== null) {
      const compensator = (this.kept()?.compensator ?? null) as Compensator | null;
      const verdict = engineVerdict(plant, compensator);
      const locate = editorLocator(this.form);
      unplaced = placeEngineIssues(verdict.issues, locate);
      for (const issue of verdict.issues) locate(issue.pointer)?.markAsTouched();
      warnings = verdict.warnings;
      if (verdict.issues.length === 0) model = { plant, compensator };
    }
    this.engineProblems.set(unplaced);
    this.warnings.set(warnings);
    this.previews.next(model);
    this.tick.update((n) => n + 1);
    return model;
  }

  private showPreview(model: PreviewModel | null): void {
    if (model) this.preview.set(model);
    this.previewStale.set(model === null);
  }

  private async send(etag: string | undefined): Promise<void> {
    if (this.saving()) return;
    this.summary.set(null);
    this.form.markAllAsTouched();
    this.check();
    if (this.form.invalid) {
      // the engine's unplaced findings have their own box; this one only says why nothing was sent
      this.summary.set({ title: 'Not saved yet: correct the marked fields first.', items: [] });
      this.focusFirstProblem();
      return;
    }
    const id = this.id();
    const input = this.input();
    this.saving.set(true);
    try {
      const saved = id ? await firstValueFrom(this.api.update(id, input, etag ?? '')) : await firstValueFrom(this.api.create(input));
      this.left = true;
      this.notices.done(`Saved as revision ${saved.model.revision}`);
      await this.router.navigate(['/models', saved.model.id]);
    } catch (error) {
      const problem = toProblem(error);
      if (problem.status === 412 && id) await this.openConflict(id);
      else this.showRefusal(problem);
    } finally {
      this.saving.set(false);
    }
  }

  /** The save body: the form's content with the compensator and design kept as they are. */
  private input(): ModelInput {
    const value: EditorValue = formValueOf(this.form);
    const kept = this.kept();
    const comment = this.form.controls.comment.value.trim();
    return {
      name: value.name.trim(),
      description: value.description.trim(),
      tags: [...value.tags],
      plant: plantOf(value.plant) as Plant,
      compensator: kept?.compensator ?? null,
      design: kept ? { gain: kept.design.gain, targets: kept.design.targets } : { gain: null, targets: null },
      comment: comment || (this.isEdit() ? '' : FIRST_COMMENT),
    };
  }

  private showRefusal(problem: ReturnType<typeof toProblem>): void {
    const unplaced = showProblemOnForm(this.form, problem, editorLocator(this.form));
    const title = problem.hasFieldErrors ? 'Not saved: the API refused some fields (marked below).' : `Not saved: ${problemSummary(problem)}`;
    this.summary.set({ title, items: unplaced });
    this.tick.update((n) => n + 1);
    this.focusFirstProblem();
  }

  /** Puts the cursor in the first field that shows a problem, once the messages are drawn. */
  private focusFirstProblem(): void {
    afterNextRender(
      () => {
        const host = this.host.nativeElement;
        host.querySelector<HTMLElement>('.mat-form-field-invalid input, .mat-form-field-invalid textarea, .mat-form-field-invalid mat-select')?.focus();
      },
      { injector: this.injector },
    );
  }

  /** 412: loads the current revision and the revisions since the base, and opens the conflict panel. */
  private async openConflict(id: string): Promise<void> {
    try {
      const [theirs, history] = await Promise.all([firstValueFrom(this.api.get(id)), firstValueFrom(this.api.revisions(id))]);
      const from = this.base()?.model.revision ?? 0;
      this.conflict.set({ theirs, newer: history.filter((r) => r.revision > from).sort((a, b) => b.revision - a.revision) });
      this.conflictOpen.set(true);
      this.check();
      afterNextRender(() => this.host.nativeElement.querySelector('pwc-conflict-panel')?.scrollIntoView?.({ block: 'start', behavior: 'smooth' }), { injector: this.injector });
    } catch (error) {
      this.showRefusal(toProblem(error));
    }
  }

  /** Accessible text of an engine finding no field takes. */
  protected problemText(problem: FieldProblem): string {
    const where = problem.pointer.startsWith('/compensator') ? 'Compensator' : problem.pointer.startsWith('/design') ? 'Design targets' : problem.pointer === '/plant' ? 'Plant' : problem.pointer || 'Model';
    return `${where}: ${problem.detail}`;
  }

  /** Where Cancel goes: the model page when editing, the library for a new model. */
  protected cancelLink(): string[] {
    const id = this.id();
    return id ? ['/models', id] : ['/models'];
  }
}
