import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, type OnInit, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import { PageHeader } from '../layout/page-header';
import { toProblem } from '../problem/api-problem';
import { MailboxApi, type MailMessage } from './mailbox-api';
import { mailSegments } from './mail-text';

/**
 * "Mailbox" (admin, development servers only): the e-mail the server captured instead of sending, newest
 * first, and the selected message with its links clickable; an invitation link opens the console's
 * invitation page. A server without a mailbox (404) gets the explanation instead of an error.
 */
@Component({
  selector: 'pwc-mailbox',
  imports: [DatePipe, PageHeader, MatListModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './mailbox.html',
  styleUrl: './mailbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Mailbox implements OnInit {
  private readonly api = inject(MailboxApi);

  protected readonly messages = signal<readonly MailMessage[]>([]);
  protected readonly selectedId = signal<string | null>(null);
  protected readonly loading = signal(true);
  protected readonly loaded = signal(false);
  /** Whether the server answered that it has no mailbox (404). */
  protected readonly absent = signal(false);
  protected readonly selected = computed(() => this.messages().find((m) => m.id === this.selectedId()) ?? null);
  protected readonly segments = computed(() => mailSegments(this.selected()?.text ?? ''));

  ngOnInit(): void {
    void this.load();
  }

  /** Loads the messages; keeps the selection when the message is still there, else picks the newest. */
  async load(): Promise<void> {
    this.loading.set(true);
    try {
      const messages = await firstValueFrom(this.api.messages());
      this.messages.set(messages);
      this.absent.set(false);
      if (!messages.some((m) => m.id === this.selectedId())) this.selectedId.set(messages[0]?.id ?? null);
      this.loaded.set(true);
    } catch (error) {
      if (toProblem(error).status === 404) this.absent.set(true);
    } finally {
      this.loading.set(false);
    }
  }

  /** Shows one message. */
  select(message: MailMessage): void {
    this.selectedId.set(message.id);
  }
}
