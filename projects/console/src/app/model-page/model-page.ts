import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { LoopStudio } from '@polewright/elements';
import { BehaviorSubject, catchError, combineLatest, distinctUntilChanged, forkJoin, map, type Observable, of, shareReplay, switchMap, tap } from 'rxjs';
import type { Model, Revision, RevisionSummary, Schemas } from '../api/api-types';
import { PageHeader } from '../layout/page-header';
import { ModelActions } from '../models/model-actions';
import { formatRoots, formatNumber, gainText, loopDomain, plantFormula, targetsText } from '../models/loop-format';
import { ModelsApi } from '../models/models-api';
import { type ApiProblem, problemSummary, toProblem } from '../problem/api-problem';
import { handles } from '../problem/problem-context';
import { Caution } from '../safety/caution';
import { Session } from '../session/session';
import type { ModelContent } from './content-fields';
import { RevisionDiff } from './revision-diff';
import { RevisionHistory } from './revision-history';
import { readPair, readShownRevision, type RevisionPair } from './revision-pair';

/** What the page is showing. */
type PageState =
  | { readonly kind: 'loading' }
  | { readonly kind: 'ready'; readonly model: Model; readonly revisions: readonly RevisionSummary[] }
  | { readonly kind: 'missing'; readonly id: string }
  | { readonly kind: 'failed'; readonly problem: ApiProblem };

/** The content shown in the upper half: the current revision, or an older one opened read-only. */
interface ShownContent {
  readonly content: ModelContent;
  readonly revision: number;
  readonly current: boolean;
  readonly author: Schemas['Person'] | null;
  readonly at: string;
  readonly comment: string;
}

/** Whether a failed read means "there is no such model" (unknown id, or one the API cannot even take as an id). */
function isMissing(problem: ApiProblem): boolean {
  return problem.status === 404 || (problem.status === 400 && problem.errors.some((e) => e.pointer.startsWith('/path/')));
}

/**
 * One model: its header and actions, its content with the loop studio on the current revision (or an
 * older revision opened read-only with `?revision=N`), the revision history, and a side-by-side
 * comparison of two revisions (`?from=&to=`, the latest two by default). Deleted models show a banner
 * (and Restore for writers); an unknown id shows a "no such model" panel.
 */
@Component({
  selector: 'pwc-model-page',
  imports: [DatePipe, RouterLink, PageHeader, MatButtonModule, MatIconModule, MatFormFieldModule, MatSelectModule, MatProgressBarModule, LoopStudio, Caution, RevisionHistory, RevisionDiff],
  templateUrl: './model-page.html',
  styleUrl: './model-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelPage {
  private readonly api = inject(ModelsApi);
  private readonly actions = inject(ModelActions);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly reload$ = new BehaviorSubject<void>(undefined);
  private readonly revisionCache = new Map<string, Observable<Revision>>();

  protected readonly state = signal<PageState>({ kind: 'loading' });
  protected readonly params = toSignal(this.route.queryParams, { initialValue: this.route.snapshot.queryParams });
  protected readonly canWrite = computed(() => this.session.can('models:write'));
  protected readonly model = computed(() => {
    const state = this.state();
    return state.kind === 'ready' ? state.model : null;
  });
  protected readonly revisions = computed(() => {
    const state = this.state();
    return state.kind === 'ready' ? state.revisions : [];
  });
  /** The revision opened read-only, or null for the current one. */
  protected readonly shownNumber = computed(() => {
    const model = this.model();
    return model ? readShownRevision(this.params(), this.revisions(), model.revision) : null;
  });
  protected readonly pair = computed(() => readPair(this.params(), this.revisions()));
  protected readonly oldRevision = signal<Revision | null>(null);
  protected readonly comparison = signal<{ readonly before: Revision; readonly after: Revision } | null>(null);
  protected readonly shown = computed<ShownContent | null>(() => {
    const model = this.model();
    if (!model) return null;
    const n = this.shownNumber();
    if (n === null) {
      const comment = this.revisions().find((r) => r.revision === model.revision)?.comment ?? '';
      return { content: model, revision: model.revision, current: true, author: model.updatedBy, at: model.updatedAt, comment };
    }
    const old = this.oldRevision();
    return old?.revision === n ? { content: old, revision: n, current: false, author: old.author, at: old.createdAt, comment: old.comment } : null;
  });
  /** The facts of the shown content, written for people. */
  protected readonly facts = computed(() => {
    const content = this.shown()?.content;
    if (!content) return null;
    const c = content.compensator;
    return {
      domain: loopDomain(content.plant),
      formula: plantFormula(content.plant),
      compensator: c ? `zeros ${formatRoots(c.zeros)}; poles ${formatRoots(c.poles)}; gain ${formatNumber(c.gain ?? 1)}` : 'none',
      gain: gainText(content.design.gain),
      targets: targetsText(content.design.targets),
    };
  });
  /** The studio's inputs: the shown loop, its design gain and targets, and a loop key of its own. */
  protected readonly studio = computed(() => {
    const shown = this.shown();
    const model = this.model();
    if (!shown || !model) return null;
    return {
      model: { plant: shown.content.plant, compensator: shown.content.compensator },
      gain: shown.content.design.gain ?? Number.NaN,
      targets: shown.content.design.targets,
      loop: `model-${model.id}-r${shown.revision}`,
      label: shown.current ? `Revision ${shown.revision} (current) at its design gain` : `Revision ${shown.revision} (read only) at its design gain`,
    };
  });
  protected readonly problemText = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? problemSummary(state.problem) : '';
  });

  constructor() {
    const id$ = this.route.paramMap.pipe(
      map((params) => params.get('id') ?? ''),
      distinctUntilChanged(),
      tap(() => this.state.set({ kind: 'loading' })),
    );
    combineLatest([id$, this.reload$])
      .pipe(
        switchMap(([id]) =>
          this.api.get(id, { includeDeleted: true, context: handles(400, 404) }).pipe(
            switchMap(({ model }) => this.api.revisions(model.id).pipe(map((revisions): PageState => ({ kind: 'ready', model, revisions })))),
            catchError((error: unknown) => {
              const problem = toProblem(error);
              return of<PageState>(isMissing(problem) ? { kind: 'missing', id } : { kind: 'failed', problem });
            }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => this.state.set(state));

    const shownKey = computed(() => ({ id: this.model()?.id ?? null, n: this.shownNumber() }), { equal: (a, b) => a.id === b.id && a.n === b.n });
    toObservable(shownKey)
      .pipe(
        switchMap(({ id, n }) => (id !== null && n !== null ? this.revisionOf(id, n).pipe(catchError(() => of(null))) : of(null))),
        takeUntilDestroyed(),
      )
      .subscribe((revision) => this.oldRevision.set(revision));

    const pairKey = computed(() => ({ id: this.model()?.id ?? null, pair: this.pair() }), { equal: (a, b) => a.id === b.id && a.pair?.from === b.pair?.from && a.pair?.to === b.pair?.to });
    toObservable(pairKey)
      .pipe(
        tap(() => this.comparison.set(null)),
        switchMap(({ id, pair }) =>
          id !== null && pair !== null && pair.from !== pair.to
            ? forkJoin({ before: this.revisionOf(id, pair.from), after: this.revisionOf(id, pair.to) }).pipe(catchError(() => of(null)))
            : of(null),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((comparison) => this.comparison.set(comparison));
  }

  /** Shows a revision read-only in the upper half (null: the current revision). */
  async view(revision: number | null): Promise<void> {
    await this.router.navigate([], { relativeTo: this.route, queryParams: { revision }, queryParamsHandling: 'merge' });
    scrollTo('pwc-model-content');
  }

  /** Compares two revisions in the lower half. */
  async compare(pair: RevisionPair): Promise<void> {
    await this.router.navigate([], { relativeTo: this.route, queryParams: { from: pair.from, to: pair.to }, queryParamsHandling: 'merge' });
    scrollTo('pwc-compare');
  }

  /** Picks the revision of one side of the comparison. */
  pick(side: keyof RevisionPair, revision: number): void {
    const pair = this.pair();
    if (pair) void this.router.navigate([], { relativeTo: this.route, queryParams: { ...pair, [side]: revision }, queryParamsHandling: 'merge' });
  }

  /** Swaps the two sides of the comparison. */
  swap(): void {
    const pair = this.pair();
    if (pair) void this.router.navigate([], { relativeTo: this.route, queryParams: { from: pair.to, to: pair.from }, queryParamsHandling: 'merge' });
  }

  /** Copies the model and opens the copy. */
  async duplicate(): Promise<void> {
    const model = this.model();
    if (model) await this.actions.duplicate(model.id);
  }

  /** Deletes the model after a confirmation (the page then shows it as deleted; Undo restores it). */
  async remove(): Promise<void> {
    const model = this.model();
    if (model && (await this.actions.remove(model, () => this.reload()))) this.reload();
  }

  /** Restores the deleted model. */
  async restore(): Promise<void> {
    const model = this.model();
    if (model && (await this.actions.restore(model))) this.reload();
  }

  /** Reads the model and its history again. */
  reload(): void {
    this.reload$.next();
  }

  /** One revision's content, read once per page (revisions never change). */
  private revisionOf(id: string, revision: number): Observable<Revision> {
    const key = `${id}:${revision}`;
    let found = this.revisionCache.get(key);
    if (!found) {
      found = this.api.revision(id, revision).pipe(shareReplay(1));
      this.revisionCache.set(key, found);
      // a failed read is not kept: the next look asks again
      found.subscribe({ error: () => this.revisionCache.delete(key) });
    }
    return found;
  }
}

function scrollTo(id: string): void {
  document.getElementById(id)?.scrollIntoView?.({ behavior: 'smooth', block: 'start' });
}
