import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { type MatSelect, MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { catchError, debounceTime, distinctUntilChanged, firstValueFrom, map, merge, of, switchMap, tap } from 'rxjs';
import type { Role, Schemas, User } from '../api/api-types';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { PageHeader } from '../layout/page-header';
import { toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { InviteDialog } from './invite-dialog';
import { PeopleApi, type PeopleQuery, type UserStatus } from './people-api';
import { ROLES, STATUSES } from './roles';

/** Page sizes offered under the table. */
const PAGE_SIZES = [25, 50, 100];

/**
 * "People" (admin): everyone in the team with server-side search, filters, sort and paging; invite a person;
 * change a role in place (asking before an admin loses their rights); deactivate or reactivate after a
 * confirmation. The signed-in admin's own row offers neither: the API would refuse, and the team could be
 * left without an admin.
 */
@Component({
  selector: 'pwc-people-list',
  imports: [
    ReactiveFormsModule,
    DatePipe,
    PageHeader,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
  ],
  templateUrl: './people-list.html',
  styleUrl: './people-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleList {
  private readonly api = inject(PeopleApi);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);
  protected readonly session = inject(Session);

  protected readonly roles = ROLES;
  protected readonly statuses = STATUSES;
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly columns = ['name', 'email', 'role', 'status', 'createdAt', 'actions'];
  protected readonly filters = inject(NonNullableFormBuilder).group({ q: [''], role: ['' as Role | ''], status: ['' as UserStatus | ''] });

  private readonly q = toSignal(
    this.filters.controls.q.valueChanges.pipe(
      debounceTime(300),
      map((v) => v.trim()),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  private readonly role = toSignal(this.filters.controls.role.valueChanges, { initialValue: '' as const });
  private readonly status = toSignal(this.filters.controls.status.valueChanges, { initialValue: '' as const });
  protected readonly sort = signal<Sort>({ active: 'name', direction: 'asc' });
  protected readonly page = signal({ index: 0, size: PAGE_SIZES[0] as number });
  private readonly reloads = signal(0);

  /** The query the table shows, as sent to `GET /users`. */
  readonly query = computed<PeopleQuery>(() => {
    const sort = this.sort();
    return {
      q: this.q() || undefined,
      role: this.role() || undefined,
      status: this.status() || undefined,
      sort: sort.direction ? (sort.active as PeopleQuery['sort']) : undefined,
      order: sort.direction || undefined,
      page: this.page().index + 1,
      pageSize: this.page().size,
    };
  });

  protected readonly loading = signal(true);
  protected readonly result = signal<Schemas['UserPage'] | null>(null);
  /** The API's refusal of the last change (e.g. the last admin), shown above the table. */
  protected readonly refusal = signal<string | null>(null);
  protected readonly meId = computed(() => this.session.me()?.user.id ?? null);
  protected readonly filtered = computed(() => Boolean(this.q() || this.role() || this.status()));

  constructor() {
    const destroyRef = inject(DestroyRef);
    // a new filter starts at the first page
    merge(toObservable(this.q), this.filters.controls.role.valueChanges, this.filters.controls.status.valueChanges)
      .pipe(takeUntilDestroyed(destroyRef))
      .subscribe(() => this.page.update((p) => (p.index === 0 ? p : { ...p, index: 0 })));
    toObservable(computed(() => ({ query: this.query(), reload: this.reloads() })))
      .pipe(
        tap(() => this.loading.set(true)),
        switchMap(({ query }) => this.api.list(query).pipe(catchError(() => of(null)))),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe((page) => {
        if (page) this.result.set(page);
        this.loading.set(false);
      });
  }

  /** Follows the table's sort header. */
  sortBy(sort: Sort): void {
    this.sort.set(sort);
    this.page.update((p) => ({ ...p, index: 0 }));
  }

  /** Follows the paginator. */
  pageTo(event: PageEvent): void {
    this.page.set({ index: event.pageIndex, size: event.pageSize });
  }

  /** Clears search and filters. */
  clearFilters(): void {
    this.filters.setValue({ q: '', role: '', status: '' });
  }

  /** Loads the current page again. */
  reload(): void {
    this.reloads.update((n) => n + 1);
  }

  /** Opens "Invite a person"; the list shows the invited person afterwards. */
  async invite(): Promise<void> {
    const invited = await firstValueFrom(this.dialog.open(InviteDialog, { width: '520px', maxWidth: '95vw' }).afterClosed());
    if (invited) this.reload();
  }

  /**
   * Changes a person's role from the row's select. Taking admin rights away asks first; a refusal of the
   * API (409: the last active admin) is shown above the table and the select goes back.
   */
  async changeRole(user: User, role: Role, select: MatSelect): Promise<void> {
    if (role === user.role) return;
    this.refusal.set(null);
    if (user.role === 'admin') {
      const confirmed = await confirmAction(this.dialog, {
        title: `Take admin rights from ${user.name}?`,
        lines: [
          `${user.name} becomes ${role}: they can no longer manage people, API keys or the audit log.`,
          'The change applies from their next action; they stay signed in. API keys they issued keep their own scopes.',
        ],
        confirm: `Make ${role}`,
        destructive: true,
      });
      if (!confirmed) {
        select.value = user.role;
        return;
      }
    }
    try {
      const updated = await firstValueFrom(this.api.update(user.id, { role }));
      this.replace(updated);
      this.notices.done(`${updated.name} is now ${updated.role}`);
    } catch (error) {
      select.value = user.role;
      this.showRefusal('Role not changed', error);
    }
  }

  /** Deactivates a person after a confirmation: every session of theirs ends at once. */
  async deactivate(user: User): Promise<void> {
    this.refusal.set(null);
    const lines = [
      `${user.name} is signed out everywhere at once: every session of theirs ends, and they cannot sign in until reactivated.`,
      'Their models, revisions and audit history stay.',
    ];
    if (user.role === 'admin') lines.push('API keys they issued stop working while they are deactivated.');
    const confirmed = await confirmAction(this.dialog, { title: `Deactivate ${user.name}?`, lines, confirm: 'Deactivate', destructive: true });
    if (confirmed) await this.setStatus(user, 'deactivated', `${user.name} deactivated; their sessions ended`);
  }

  /** Reactivates a person after a confirmation: they can sign in again with their password. */
  async reactivate(user: User): Promise<void> {
    this.refusal.set(null);
    const confirmed = await confirmAction(this.dialog, {
      title: `Reactivate ${user.name}?`,
      lines: [`${user.name} can sign in again with their password, as ${user.role}.`],
      confirm: 'Reactivate',
    });
    if (confirmed) await this.setStatus(user, 'active', `${user.name} reactivated`);
  }

  private async setStatus(user: User, status: 'active' | 'deactivated', done: string): Promise<void> {
    try {
      this.replace(await firstValueFrom(this.api.update(user.id, { status })));
      this.notices.done(done);
    } catch (error) {
      this.showRefusal(status === 'active' ? 'Not reactivated' : 'Not deactivated', error);
    }
  }

  private showRefusal(what: string, error: unknown): void {
    const problem = toProblem(error);
    // other statuses went to the snackbar already (the interceptor)
    if (problem.status === 409) this.refusal.set(`${what}: ${problem.detail || problem.title}`);
  }

  private replace(user: User): void {
    this.result.update((page) => (page ? { ...page, items: page.items.map((u) => (u.id === user.id ? user : u)) } : page));
  }
}
