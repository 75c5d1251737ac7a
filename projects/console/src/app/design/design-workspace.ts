import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, InjectionToken, input, signal, untracked, viewChild } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { DEFAULT_GAIN, describeError, GainControl, LocusPlot, LoopRegistry, loopPlant, type LoopModel, type ModelEditDetail, PoleTable, StabilitySummary, StepPlot } from '@polewright/elements';
import { normalizePlant } from '@polewright/locus-core';
import { catchError, concat, debounceTime, distinctUntilChanged, firstValueFrom, map, type Observable, of, switchMap } from 'rxjs';
import type { DesignTargets } from '../api/api-types';
import { showProblemOnForm } from '../forms/form-problems';
import { PageHeader } from '../layout/page-header';
import { ModelsApi, type TaggedModel } from '../models/models-api';
import { ApiProblem, type FieldProblem, problemSummary, toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { handles } from '../problem/problem-context';
import { Session } from '../session/session';
import { CompensatorTable } from './compensator-table';
import { compensatorToSave, type LoopCompensator, loopCompensatorOf, sameCompensator } from './compensator-rows';
import { designRequestOf } from './design-request';
import { type DesignOutcome, FeasibleRangesPanel, NO_DESIGN } from './feasible-ranges-panel';
import { insideRanges } from './feasible-ranges';
import { GainVerdict } from './gain-verdict';
import type { LeaveCheck } from '../confirm/unsaved-changes';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { SaveRevisionDialog, type SaveRevisionData, type SaveRevisionResult } from './save-revision-dialog';
import { designForm, formValueOf, sameTargets, targetsOf } from './targets-form';
import { TargetsPanel } from './targets-panel';

/** How long the workspace waits after the last edit before asking the API for feasible gains (ms). */
export const DESIGN_DEBOUNCE_MS = new InjectionToken<number>('DESIGN_DEBOUNCE_MS', { factory: () => 300 });

/** A save the API refused: its words, and the field errors no field on screen could take. */
interface SaveProblem {
  readonly summary: string;
  readonly unplaced: readonly FieldProblem[];
}

/**
 * The design workspace of one model (`/models/:id/design`): the locus plot (editable with `models:write`),
 * gain control, step response, pole table and stability summary on one shared loop; design targets with the
 * feasible gain ranges the API finds for them; the compensator as a table; and "Save as new revision" with
 * a comment, `If-Match` and conflict handling. The loop on screen lives in the elements' store
 * (`LoopRegistry`, key `design-<id>`): the workspace puts the model, gain and compensator there, and every
 * element — and the verdict here — reads the engine's results from it.
 */
@Component({
  selector: 'pwc-design-workspace',
  imports: [
    DatePipe,
    RouterLink,
    PageHeader,
    MatCardModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
    LocusPlot,
    GainControl,
    StepPlot,
    PoleTable,
    StabilitySummary,
    TargetsPanel,
    FeasibleRangesPanel,
    CompensatorTable,
    GainVerdict,
  ],
  templateUrl: './design-workspace.html',
  styleUrl: './design-workspace.scss',
  host: { '(window:beforeunload)': 'holdUnload($event)' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignWorkspace implements LeaveCheck {
  /** The model's id (route parameter). */
  readonly id = input.required<string>();

  private readonly api = inject(ModelsApi);
  private readonly registry = inject(LoopRegistry);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly destroyRef = inject(DestroyRef);
  private readonly session = inject(Session);
  private readonly table = viewChild(CompensatorTable);

  protected readonly canWrite = computed(() => this.session.can('models:write'));
  protected readonly loaded = signal<TaggedModel | null>(null);
  protected readonly loadProblem = signal<ApiProblem | null>(null);
  protected readonly loopKey = computed(() => `design-${this.id()}`);
  protected readonly loop = computed(() => this.registry.loop(this.loopKey()));

  protected readonly form = designForm();
  /** The targets last entered validly (what the elements and the API get). */
  protected readonly targets = signal<DesignTargets | null>(null, { equal: sameTargets });
  protected readonly dominantOnly = signal(false);
  private readonly formValid = signal(true);
  /** The compensator on screen (the table's or the plot's last complete edit). */
  protected readonly compensator = signal<LoopCompensator | null>(null);
  /** Why the table's last entry was not applied to the loop, else null. */
  protected readonly compensatorProblem = signal<string | null>(null);
  private readonly tableValid = signal(true);
  /** Bumped to make the compensator table rebuild from `compensator` (load, revert). */
  protected readonly tableVersion = signal(0);
  private readonly baselineGain = signal(DEFAULT_GAIN);
  protected readonly saveProblem = signal<SaveProblem | null>(null);

  protected readonly gain = computed(() => this.loop().gain());
  protected readonly domain = computed(() => this.loop().locus()?.domain ?? 's');
  protected readonly stable = computed(() => this.loop().closedLoop()?.stable ?? null);
  protected readonly stableRanges = computed(() => this.loop().locus()?.stableGainRanges ?? []);
  protected readonly loopModel = computed<LoopModel | null>(() => {
    const tagged = this.loaded();
    return tagged ? { plant: tagged.model.plant as LoopModel['plant'], compensator: this.compensator(), name: tagged.model.name } : null;
  });
  /** The `POST /design` body for the loop and targets on screen. */
  protected readonly request = computed(() => {
    const model = this.loopModel();
    if (!model) return null;
    try {
      return designRequestOf(model, this.targets(), this.dominantOnly());
    } catch {
      return null; // an improper loop never reaches the store (see applyCompensator)
    }
  });
  protected readonly design = signal<DesignOutcome>(NO_DESIGN);
  protected readonly meetsTargets = computed(() => {
    const { request, result } = this.design();
    return request?.targets && result ? insideRanges(result.gainRanges, this.gain()) : null;
  });
  /** What differs from the revision loaded. */
  protected readonly changes = computed<string[]>(() => {
    const tagged = this.loaded();
    if (!tagged) return [];
    const out: string[] = [];
    if (!sameCompensator(this.compensator(), loopCompensatorOf(tagged.model.compensator)) || !this.tableValid() || this.compensatorProblem()) out.push('compensator');
    if (!sameGain(this.gain(), this.baselineGain())) out.push('gain');
    if (!sameTargets(this.targets(), tagged.model.design.targets) || !this.formValid()) out.push('targets');
    return out;
  });
  protected readonly canSave = computed(() => this.canWrite() && this.changes().length > 0 && this.formValid() && this.tableValid() && !this.compensatorProblem());
  protected readonly saveBlocker = computed(() => {
    if (!this.changes().length) return 'Nothing to save: no edits since this revision.';
    if (!this.formValid()) return 'Fix the targets marked in red first.';
    if (!this.tableValid() || this.compensatorProblem()) return 'Fix the compensator first.';
    return '';
  });

  constructor() {
    const debounceMs = inject(DESIGN_DEBOUNCE_MS);
    effect(() => {
      const id = this.id();
      untracked(() => this.load(id, false));
    });
    // the compensator on screen goes into the loop store, unless the store already holds it (a plot edit)
    effect(() => {
      const compensator = this.compensator();
      const tagged = this.loaded();
      const loop = this.loop();
      if (!tagged) return;
      untracked(() => {
        const current = loop.model();
        if (current && current.plant === tagged.model.plant && current.compensator === compensator) return;
        loop.setModel({ plant: tagged.model.plant as LoopModel['plant'], compensator, name: tagged.model.name });
      });
    });
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.applyForm());
    this.form.statusChanges.pipe(takeUntilDestroyed()).subscribe(() => this.formValid.set(this.form.valid));
    toObservable(this.request)
      .pipe(
        debounceTime(debounceMs),
        distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
        switchMap((request): Observable<DesignOutcome> => {
          if (!request) return of(NO_DESIGN);
          const asked = this.api.design(request).pipe(
            map((result): DesignOutcome => ({ loading: false, request, result, problem: null })),
            catchError((error: unknown) => of<DesignOutcome>({ loading: false, request, result: null, problem: toProblem(error) })),
          );
          return concat(of<DesignOutcome>({ ...untracked(this.design), loading: true }), asked);
        }),
        takeUntilDestroyed(),
      )
      .subscribe((outcome) => {
        this.design.set(outcome);
        // the API's target errors (`/targets/minDampingRatio` …) land at their fields
        if (outcome.problem) showProblemOnForm(this.form, outcome.problem);
      });
  }

  /** Sets the loop's gain (a suggested gain picked in the ranges table). */
  protected useGain(gain: number): void {
    this.loop().setGain(gain);
  }

  /** A compensator from the table: applied when the loop stays usable, else the reason is shown there. */
  protected applyCompensator(compensator: LoopCompensator | null): void {
    const tagged = this.loaded();
    if (!tagged) return;
    try {
      const loop = loopPlant({ plant: tagged.model.plant as LoopModel['plant'], compensator });
      // as the server checks a saved loop: the whole loop must normalise (degree limit, properness)
      if (compensator !== null) normalizePlant(loop, '/plant');
      this.compensatorProblem.set(null);
      this.compensator.set(compensator);
    } catch (error) {
      this.compensatorProblem.set(`Not applied: ${describeError(error)}`);
    }
  }

  /** A complete compensator edit on the plot (`pw-model-edit`). */
  protected plotEdited(event: Event): void {
    const detail = (event as CustomEvent<ModelEditDetail>).detail;
    this.compensatorProblem.set(null);
    this.compensator.set(detail.compensator);
  }

  protected tableValidity(valid: boolean): void {
    this.tableValid.set(valid);
  }

  /** Drops every unsaved edit: back to the revision loaded. */
  protected revert(): void {
    const tagged = this.loaded();
    if (tagged) this.adopt(tagged);
  }

  /** Opens the save dialog; adopts what was saved, reloads, or shows the refused fields. */
  protected async save(): Promise<void> {
    const loaded = this.loaded();
    if (!loaded || !this.canSave()) return;
    const data: SaveRevisionData = { loaded, edits: { compensator: compensatorToSave(this.compensator()), gain: this.gain(), targets: this.targets() } };
    const ref = this.dialog.open<SaveRevisionDialog, SaveRevisionData, SaveRevisionResult>(SaveRevisionDialog, { data, width: '640px', maxWidth: '95vw', autoFocus: 'dialog' });
    const result = await firstValueFrom(ref.afterClosed());
    if (!result) return;
    if (result.kind === 'saved') {
      this.adopt(result.saved);
      this.notices.done(`Saved as revision ${result.saved.model.revision}`);
    } else if (result.kind === 'reload') {
      this.load(loaded.model.id, true);
    } else {
      this.showSaveProblem(result.problem);
    }
  }

  /** The leave guard's question: true at once without unsaved edits. */
  canLeave(): boolean | Promise<boolean> {
    if (!this.canWrite() || this.changes().length === 0) return true;
    return confirmAction(this.dialog, {
      title: 'Leave without saving?',
      lines: [`These edits are not saved and will be lost: ${this.changes().join(', ')}.`],
      confirm: 'Leave and drop them',
      cancel: 'Stay',
    });
  }

  /** Closing or reloading the tab with unsaved edits: the browser asks. */
  protected holdUnload(event: BeforeUnloadEvent): void {
    if (this.canWrite() && this.changes().length > 0) {
      event.preventDefault();
      event.returnValue = '';
    }
  }

  private load(id: string, keep: boolean): void {
    if (!keep) this.loaded.set(null);
    this.loadProblem.set(null);
    this.api
      .get(id, { context: handles(404) })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (tagged) => this.adopt(tagged), error: (error: unknown) => this.loadProblem.set(toProblem(error)) });
  }

  // shows a revision: its compensator, gain and targets become the workspace's (edits dropped)
  private adopt(tagged: TaggedModel): void {
    const { model } = tagged;
    const loop = this.loop();
    const compensator = loopCompensatorOf(model.compensator);
    this.saveProblem.set(null);
    this.compensatorProblem.set(null);
    this.tableValid.set(true);
    this.compensator.set(compensator);
    this.tableVersion.update((n) => n + 1);
    this.form.reset(formValueOf(model.design.targets, this.form.controls.dominantOnly.value));
    this.applyForm();
    loop.setModel({ plant: model.plant as LoopModel['plant'], compensator, name: model.name });
    const gain = model.design.gain ?? DEFAULT_GAIN;
    loop.setGain(gain);
    this.baselineGain.set(gain);
    this.loaded.set(tagged);
  }

  private applyForm(): void {
    this.formValid.set(this.form.valid);
    if (this.form.invalid) return;
    const value = this.form.getRawValue();
    this.targets.set(targetsOf(value.targets));
    this.dominantOnly.set(value.dominantOnly);
  }

  // a refused save: target errors at their fields, compensator errors on their lines, the rest in a banner
  private showSaveProblem(problem: ApiProblem): void {
    const onTargets = problem.errors.filter((e) => e.pointer.startsWith('/design/targets/')).map((e) => ({ pointer: e.pointer.slice('/design'.length), detail: e.detail }));
    const onCompensator = problem.errors.filter((e) => e.pointer.startsWith('/compensator'));
    const others = problem.errors.filter((e) => !e.pointer.startsWith('/design/targets/') && !e.pointer.startsWith('/compensator'));
    const unplaced = [
      ...showProblemOnForm(this.form, new ApiProblem(problem.status, problem.title, problem.detail, onTargets)),
      ...(this.table()?.showErrors(onCompensator) ?? onCompensator),
      ...others,
    ];
    this.formValid.set(this.form.valid);
    this.saveProblem.set({ summary: `Not saved. ${problemSummary(problem)}`, unplaced });
  }
}

/** Gains equal to rounding (a gain typed back in as shown counts as unchanged). */
function sameGain(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}
