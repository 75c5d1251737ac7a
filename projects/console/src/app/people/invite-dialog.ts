import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Role, Schemas } from '../api/api-types';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { problemSummary, toProblem } from '../problem/api-problem';
import { ServerHealth } from '../server-info/server-health';
import { PeopleApi } from './people-api';
import { ROLES } from './roles';

/**
 * "Invite a person": e-mail, role and an optional name. After sending it says to whom the invitation went
 * and until when its link works; closes with the invitation (or nothing when cancelled).
 */
@Component({
  selector: 'pwc-invite-dialog',
  imports: [ReactiveFormsModule, DatePipe, RouterLink, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatIconModule, MatProgressBarModule, FieldMessagePipe],
  templateUrl: './invite-dialog.html',
  styleUrl: './invite-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteDialog {
  private readonly api = inject(PeopleApi);
  private readonly ref = inject<MatDialogRef<InviteDialog, Schemas['UserInvited']>>(MatDialogRef);
  /** Whether this server keeps e-mail in its development mailbox (then the dialog links to it). */
  protected readonly hasMailbox = inject(ServerHealth).hasMailbox();

  protected readonly roles = ROLES;
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    role: ['engineer' as Role, Validators.required],
    name: ['', Validators.maxLength(120)],
  });
  protected readonly role = toSignal(this.form.controls.role.valueChanges, { initialValue: this.form.controls.role.value });
  /** What the picked role may do. */
  protected readonly roleHelp = computed(() => ROLES.find((r) => r.role === this.role())?.explanation ?? '');
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** The invitation, once sent. */
  protected readonly sent = signal<Schemas['UserInvited'] | null>(null);

  /** The request body for the form's values (the name only when given). */
  protected body(): Schemas['UserInvite'] {
    const { email, role, name } = this.form.getRawValue();
    const trimmed = name.trim();
    return trimmed ? { email: email.trim(), role, name: trimmed } : { email: email.trim(), role };
  }

  /** Sends the invitation; a taken e-mail (409) and field errors show at the fields. */
  async invite(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      this.sent.set(await firstValueFrom(this.api.invite(this.body())));
      this.form.disable();
    } catch (error) {
      const problem = toProblem(error);
      if (problem.status === 409) {
        this.form.controls.email.setErrors({ server: problem.detail || 'Someone with this e-mail is already in the team.' });
        this.form.controls.email.markAsTouched();
        return;
      }
      const unplaced = showProblemOnForm(this.form, problem);
      if (!problem.hasFieldErrors || unplaced.length > 0) this.problem.set(problemSummary(problem));
    } finally {
      this.busy.set(false);
    }
  }

  /** Closes with the invitation sent (if any). */
  done(): void {
    this.ref.close(this.sent() ?? undefined);
  }
}
