import { DatePipe, DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, type OnInit, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { firstValueFrom, forkJoin } from 'rxjs';
import type { User } from '../api/api-types';
import { confirmAction } from '../confirm/confirm-action-dialog';
import { PageHeader } from '../layout/page-header';
import { PeopleApi, byId, personName } from '../people/people-api';
import { Notices } from '../problem/notices';
import { IssueKeyDialog } from './issue-key-dialog';
import { KeySecretDialog, type KeySecret } from './key-secret-dialog';
import { keyStatus, type KeyStatus } from './key-status';
import { type ApiKey, type ApiKeyCreated, KeysApi } from './keys-api';

/** A key as the table shows it: the record plus its issuer's name and status now. */
interface KeyRow {
  readonly key: ApiKey;
  readonly issuer: string;
  readonly status: KeyStatus;
}

/**
 * "API keys" (admin): every key with its scopes, issuer, dates and status; issue a key (its secret is
 * shown once, in a dialog that only closes on purpose); revoke one after a confirmation. Revoked keys
 * stay listed, greyed. The list never holds a secret.
 */
@Component({
  selector: 'pwc-key-list',
  imports: [DatePipe, PageHeader, MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule, MatTooltipModule],
  templateUrl: './key-list.html',
  styleUrl: './key-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyList implements OnInit {
  private readonly api = inject(KeysApi);
  private readonly people = inject(PeopleApi);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly origin = inject(DOCUMENT).location.origin;

  protected readonly columns = ['name', 'prefix', 'scopes', 'issuer', 'createdAt', 'expiresAt', 'lastUsedAt', 'status', 'actions'];
  private readonly keys = signal<readonly ApiKey[]>([]);
  private readonly directory = signal<ReadonlyMap<string, User>>(new Map());
  /** When the statuses were worked out (epoch ms; refreshed with every load). */
  private readonly now = signal(Date.now());
  protected readonly loading = signal(true);
  protected readonly loaded = signal(false);
  protected readonly rows = computed<KeyRow[]>(() =>
    this.keys().map((key) => ({ key, issuer: personName(this.directory(), key.createdBy), status: keyStatus(key, this.now()) })),
  );

  ngOnInit(): void {
    void this.load();
  }

  /** Loads the keys and the people who issued them. */
  async load(): Promise<void> {
    this.loading.set(true);
    try {
      const { keys, people } = await firstValueFrom(forkJoin({ keys: this.api.list(), people: this.people.directory() }));
      this.keys.set(keys);
      this.directory.set(byId(people));
      this.now.set(Date.now());
      this.loaded.set(true);
    } catch {
      // the interceptor has shown the problem; the table keeps what it had
    } finally {
      this.loading.set(false);
    }
  }

  /** Opens "Issue key"; a new key's secret then goes to the copy-once dialog, never into the list. */
  async issue(): Promise<void> {
    const created = await firstValueFrom(this.dialog.open<IssueKeyDialog, void, ApiKeyCreated>(IssueKeyDialog, { width: '580px', maxWidth: '95vw', autoFocus: 'first-tabbable' }).afterClosed());
    if (!created) return;
    const { secret, ...key } = created;
    this.keys.update((keys) => [key, ...keys.filter((k) => k.id !== key.id)]);
    const data: KeySecret = { key, secret, origin: this.origin };
    await firstValueFrom(this.dialog.open<KeySecretDialog, KeySecret, void>(KeySecretDialog, { data, disableClose: true, width: '780px', maxWidth: '95vw', autoFocus: 'dialog' }).afterClosed());
    await this.load();
  }

  /** Asks, then revokes a key: calls with it are refused from then on. */
  async revoke(key: ApiKey): Promise<void> {
    const confirmed = await confirmAction(this.dialog, {
      title: `Revoke the key “${key.name}”?`,
      lines: [
        `Every script or service using the key ${key.prefix}… is refused from this moment on.`,
        'The key stays in the list, marked revoked, and cannot be used again. Issue a new key if it is still needed.',
      ],
      confirm: 'Revoke key',
      destructive: true,
    });
    if (!confirmed) return;
    try {
      await firstValueFrom(this.api.revoke(key.id));
      this.notices.done(`Key “${key.name}” revoked`);
    } catch {
      // shown by the interceptor
    }
    await this.load();
  }
}
