import { DatePipe, JsonPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, distinctUntilChanged, map, of, startWith, Subject, switchMap, tap } from 'rxjs';
import type { Schemas, User } from '../api/api-types';
import { PageHeader } from '../layout/page-header';
import { PeopleApi, byId, personName } from '../people/people-api';
import { actionSuggestions } from './audit-actions';
import { type AuditEvent, AuditApi } from './audit-api';
import { detailSummary } from './audit-detail';
import { AUDIT_PAGE_SIZES, auditQuery, type AuditUrlState, DEFAULT_AUDIT_PAGE_SIZE, formatDay, parseDay, positiveInt, urlParams } from './audit-filters';

/** An event as the table shows it. */
interface EventRow {
  readonly event: AuditEvent;
  readonly actor: string;
  /** The target's label: a person's name for users, else the id shortened. */
  readonly target: string;
  readonly summary: string;
}

/**
 * "Audit log" (admin): the server's audit trail, newest first, paged on the server, filtered by action
 * (exact, or a family such as `api-key.`), actor and days. The filters live in the URL (`action`, `actor`,
 * `from`, `to`, `page`, `size`), so a filtered view can be bookmarked or shared and Back undoes a filter.
 */
@Component({
  selector: 'pwc-audit-log',
  imports: [
    ReactiveFormsModule,
    DatePipe,
    JsonPipe,
    RouterLink,
    PageHeader,
    MatTableModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatAutocompleteModule,
    MatDatepickerModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
  ],
  providers: [provideNativeDateAdapter()],
  templateUrl: './audit-log.html',
  styleUrl: './audit-log.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditLog {
  private readonly api = inject(AuditApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);

  /** Query parameters (bound by the router). */
  readonly action = input<string>();
  readonly actor = input<string>();
  readonly from = input<string>();
  readonly to = input<string>();
  readonly page = input<string>();
  readonly size = input<string>();

  protected readonly columns = ['at', 'actor', 'action', 'target', 'detail', 'expand'];
  protected readonly pageSizes = AUDIT_PAGE_SIZES;
  protected readonly filters = inject(NonNullableFormBuilder).group({
    action: [''],
    actor: [''],
    range: new FormGroup({ start: new FormControl<Date | null>(null), end: new FormControl<Date | null>(null) }),
  });
  protected readonly people = toSignal(inject(PeopleApi).directory().pipe(catchError(() => of([] as User[]))), { initialValue: [] as User[] });
  private readonly directory = computed(() => byId(this.people()));
  protected readonly suggestions = toSignal(this.filters.controls.action.valueChanges.pipe(startWith(''), map(actionSuggestions)), { initialValue: actionSuggestions('') });

  /** The screen's state as the URL has it. */
  readonly state = computed<AuditUrlState>(() => ({
    action: this.action() || undefined,
    actor: this.actor() || undefined,
    from: this.from() || undefined,
    to: this.to() || undefined,
    page: positiveInt(this.page()),
    size: positiveInt(this.size()),
  }));
  /** The API query for that state. */
  readonly query = computed(() => auditQuery(this.state()));

  /** Edits of the days by the person (`dateChange` of either range input). */
  protected readonly rangeEdits = new Subject<void>();
  protected readonly loading = signal(true);
  protected readonly result = signal<Schemas['AuditPage'] | null>(null);
  protected readonly expanded = signal<number | null>(null);
  protected readonly rows = computed<EventRow[]>(() =>
    (this.result()?.items ?? []).map((event) => ({
      event,
      actor: personName(this.directory(), event.actorId),
      target: this.targetLabel(event),
      summary: detailSummary(event.detail),
    })),
  );
  protected readonly filtered = computed(() => {
    const s = this.state();
    return Boolean(s.action || s.actor || s.from || s.to);
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    // URL → form (without echoing back)
    effect(() => {
      const s = this.state();
      untracked(() =>
        this.filters.setValue({ action: s.action ?? '', actor: s.actor ?? '', range: { start: parseDay(s.from), end: parseDay(s.to) } }, { emitEvent: false }),
      );
    });
    // form → URL: typing settles first; picks apply at once
    this.filters.controls.action.valueChanges.pipe(debounceTime(400), distinctUntilChanged(), takeUntilDestroyed(destroyRef)).subscribe((action) => this.apply({ action }));
    this.filters.controls.actor.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((actor) => this.apply({ actor }));
    // days: only edits by the person (typed and left, or picked in the calendar) count; the form's own
    // value changes also fire while the URL is written back into the range inputs
    this.rangeEdits.pipe(debounceTime(50), takeUntilDestroyed(destroyRef)).subscribe(() => this.applyRange());
    // URL → API
    toObservable(this.query)
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap((query) => this.api.list(query).pipe(catchError(() => of(null)))),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe((page) => {
        if (page) this.result.set(page);
        this.loading.set(false);
      });
  }

  /** Puts changed filters into the URL, back at the first page. */
  apply(patch: Partial<AuditUrlState>): void {
    const next = urlParams({ ...this.state(), ...patch, page: undefined });
    if (JSON.stringify(next) === JSON.stringify(urlParams(this.state()))) return;
    void this.router.navigate([], { relativeTo: this.route, queryParams: next });
  }

  /** Puts the picked days into the URL (each end may be open). */
  applyRange(): void {
    const { start, end } = this.filters.controls.range.getRawValue();
    const valid = (d: Date | null) => d instanceof Date && !Number.isNaN(d.getTime());
    if ((start && !valid(start)) || (end && !valid(end))) return;
    this.apply({ from: start ? formatDay(start) : undefined, to: end ? formatDay(end) : undefined });
  }

  /** Takes an action family or exact action from the suggestions. */
  pickAction(action: string): void {
    this.apply({ action });
  }

  /** Clears every filter. */
  clearFilters(): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: urlParams({ size: this.state().size }) });
  }

  /** Follows the paginator. */
  pageTo(event: PageEvent): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: urlParams({ ...this.state(), page: event.pageIndex + 1, size: event.pageSize }) });
  }

  /** Opens or closes an event's full detail. */
  toggle(event: AuditEvent): void {
    this.expanded.update((id) => (id === event.id ? null : event.id));
  }

  /** Shows only this person's actions. */
  filterByActor(event: AuditEvent): void {
    if (event.actorId) this.apply({ actor: event.actorId });
  }

  protected pageIndex(): number {
    return (this.query().page ?? 1) - 1;
  }

  protected pageSize(): number {
    return this.query().pageSize ?? DEFAULT_AUDIT_PAGE_SIZE;
  }

  private targetLabel(event: AuditEvent): string {
    if (!event.targetId) return '';
    if (event.targetType === 'user') return this.directory().get(event.targetId)?.name ?? event.targetId.slice(0, 8);
    return event.targetId.length > 12 ? `${event.targetId.slice(0, 8)}…` : event.targetId;
  }
}
