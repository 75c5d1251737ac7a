import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { BehaviorSubject, catchError, combineLatest, debounceTime, distinctUntilChanged, map, of, switchMap, tap } from 'rxjs';
import type { Model, ModelPage } from '../api/api-types';
import { PageHeader } from '../layout/page-header';
import { type ApiProblem, problemSummary, toProblem } from '../problem/api-problem';
import { Session } from '../session/session';
import { defaultOrder, isFiltered, type LibraryQuery, libraryQueryParams, listQuery, PAGE_SIZES, readLibraryQuery } from './library-query';
import { ModelActions } from './model-actions';
import { gainText, loopDomain, type LoopDomain } from './loop-format';
import { ModelsApi, type TagCount } from './models-api';

/** How long the search field waits after the last key before it asks the API. */
export const SEARCH_DEBOUNCE_MS = 300;

/** One row of the table. */
interface LibraryRow {
  readonly model: Model;
  readonly domain: LoopDomain;
  readonly gain: string;
}

/** What the library says when the page holds no rows. */
type EmptyKind = 'none' | 'no-models' | 'no-match' | 'past-end';

/**
 * The model library: every loop model in a Material table with the search, tag filter, sort and paging
 * done by the API. The view lives in the URL's query parameters (shareable, Back works); writers create,
 * duplicate, delete (with Undo) and restore from here.
 */
@Component({
  selector: 'pwc-model-library',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    PageHeader,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatTooltipModule,
  ],
  templateUrl: './model-library.html',
  styleUrl: './model-library.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelLibrary {
  private readonly api = inject(ModelsApi);
  private readonly actions = inject(ModelActions);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly reload$ = new BehaviorSubject<void>(undefined);

  /** The view the URL asks for. */
  protected readonly query = signal<LibraryQuery>(readLibraryQuery(this.route.snapshot.queryParams));
  protected readonly canWrite = computed(() => this.session.can('models:write'));
  protected readonly page = signal<ModelPage | null>(null);
  protected readonly loading = signal(true);
  protected readonly failure = signal<ApiProblem | null>(null);
  protected readonly tags = signal<readonly TagCount[]>([]);
  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly columns = ['name', 'domain', 'tags', 'revision', 'gain', 'updatedAt', 'actions'] as const;
  protected readonly pageSizes = PAGE_SIZES;
  /** The rows of the table: each model with its plane and gain as shown. */
  protected readonly rows = computed<LibraryRow[]>(() => (this.page()?.items ?? []).map((model) => ({ model, domain: loopDomain(model.plant), gain: gainText(model.design.gain, 4) })));
  protected readonly filtered = computed(() => isFiltered(this.query()));
  /** The tag choices: every tag in use with its count, plus the filtered tag when no live model carries it. */
  protected readonly tagOptions = computed(() => {
    const tag = this.query().tag;
    const known = this.tags();
    return tag && !known.some((t) => t.tag === tag) ? [...known, { tag, count: 0 }] : known;
  });
  protected readonly empty = computed<EmptyKind>(() => {
    const page = this.page();
    if (!page || page.items.length > 0) return 'none';
    if (page.total > 0) return 'past-end';
    return this.filtered() ? 'no-match' : 'no-models';
  });
  protected readonly problemText = computed(() => {
    const problem = this.failure();
    return problem ? problemSummary(problem) : '';
  });

  constructor() {
    const query$ = this.route.queryParams.pipe(
      map(readLibraryQuery),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      tap((query) => this.query.set(query)),
    );
    combineLatest([query$, this.reload$])
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap(([query]) =>
          this.api.list(listQuery(query)).pipe(
            map((page) => ({ page, problem: null })),
            catchError((error: unknown) => of({ page: null, problem: toProblem(error) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ page, problem }) => {
        this.loading.set(false);
        this.failure.set(problem);
        if (page) this.page.set(page);
      });

    this.search.valueChanges
      .pipe(
        debounceTime(SEARCH_DEBOUNCE_MS),
        map((text) => text.trim()),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((q) => {
        if (q !== this.query().q) this.show({ q, page: 1 });
      });
    // Back/Forward or a shared link: the field shows the URL's search text
    effect(() => {
      const q = this.query().q;
      untracked(() => {
        if (this.search.value.trim() !== q) this.search.setValue(q, { emitEvent: false });
      });
    });
    this.loadTags();
  }

  /** Sorts by a column header (name, last change); back to the first page. */
  sortBy(sort: Sort): void {
    const key = sort.active as LibraryQuery['sort'];
    this.show({ sort: key, order: sort.direction || defaultOrder(key), page: 1 });
  }

  /** Follows the paginator (page and page size). */
  pageTo(event: PageEvent): void {
    this.show({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  /** Shows only models with this tag ('' for all). */
  filterByTag(tag: string): void {
    this.show({ tag, page: 1 });
  }

  /** Shows or hides deleted models. */
  showDeleted(include: boolean): void {
    this.show({ includeDeleted: include, page: 1 });
  }

  /** Empties the search field (the tag filter stays). */
  clearSearch(): void {
    this.search.setValue('', { emitEvent: false });
    this.show({ q: '', page: 1 });
  }

  /** Empties the search field and the tag filter. */
  clearFilters(): void {
    this.search.setValue('', { emitEvent: false });
    this.show({ q: '', tag: '', page: 1 });
  }

  /** Goes back to the first page (after the last rows of a page went away). */
  firstPage(): void {
    this.show({ page: 1 });
  }

  /** Copies a model and opens the copy. */
  async duplicate(model: Model): Promise<void> {
    await this.actions.duplicate(model.id);
  }

  /** Deletes a model after a confirmation; Undo in the snackbar brings it back. */
  async remove(model: Model): Promise<void> {
    if (await this.actions.remove(model, () => this.refresh())) this.refresh();
  }

  /** Restores a deleted model. */
  async restore(model: Model): Promise<void> {
    if (await this.actions.restore(model)) this.refresh();
  }

  /** Asks the API for the current page and the tag counts again. */
  refresh(): void {
    this.reload$.next();
    this.loadTags();
  }

  private show(change: Partial<LibraryQuery>): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: libraryQueryParams({ ...this.query(), ...change }) });
  }

  private loadTags(): void {
    this.api.tags().subscribe({ next: (tags) => this.tags.set(tags), error: () => undefined });
  }
}
