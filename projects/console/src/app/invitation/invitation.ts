import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, type OnInit, signal } from '@angular/core';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { type ApiProblem, toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { type InvitationDetails, InvitationsApi } from './invitations-api';

/** Shortest password the API takes (`Password`, minLength). */
export const MIN_PASSWORD_LENGTH = 10;

/** What the page shows: the invitation's state, or why it could not be read. */
export type InvitationView =
  | { readonly kind: 'loading' }
  | { readonly kind: 'open' | 'used' | 'expired'; readonly invitation: InvitationDetails }
  | { readonly kind: 'unknown' }
  | { readonly kind: 'unreachable'; readonly problem: ApiProblem };

/** Whether the repeated password is the same as the password (the error sits on `repeat`). */
export function repeatMatches(group: AbstractControl): ValidationErrors | null {
  const password = group.get('password')?.value as string | undefined;
  const repeat = group.get('repeat');
  if (!repeat || !password || !repeat.value || repeat.value === password) {
    if (repeat?.hasError('mismatch')) {
      const { mismatch: _, ...rest } = repeat.errors ?? {};
      repeat.setErrors(Object.keys(rest).length ? rest : null);
    }
    return null;
  }
  repeat.setErrors({ ...(repeat.errors ?? {}), mismatch: { message: 'The two passwords differ.' } });
  return null;
}

/**
 * The page behind the link of an invitation e-mail (`/invitations/:token`, outside the shell): reads the
 * invitation (`GET /invitations/{token}`), and while it is open asks for a name and password; accepting
 * answers with a session, which the console adopts before going to the models.
 */
@Component({
  selector: 'pwc-invitation',
  imports: [ReactiveFormsModule, DatePipe, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, FieldMessagePipe],
  templateUrl: './invitation.html',
  styleUrl: './invitation.scss',
  host: { class: 'pwc-lone-page' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Invitation implements OnInit {
  private readonly invitations = inject(InvitationsApi);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  protected readonly session = inject(Session);
  /** The token of the link (route parameter). */
  readonly token = input.required<string>();

  protected readonly minLength = MIN_PASSWORD_LENGTH;
  protected readonly view = signal<InvitationView>({ kind: 'loading' });
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      name: ['', [Validators.required, Validators.maxLength(120)]],
      password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH), Validators.maxLength(200)]],
      repeat: ['', Validators.required],
    },
    { validators: repeatMatches },
  );
  protected readonly busy = signal(false);
  protected readonly refusal = signal<string | null>(null);
  protected readonly showPassword = signal(false);

  ngOnInit(): void {
    void this.load();
  }

  /** Reads the invitation again (after a failed read, or when accepting found it used or expired). */
  async load(): Promise<void> {
    this.view.set({ kind: 'loading' });
    try {
      const invitation = await firstValueFrom(this.invitations.get(this.token()));
      if (invitation.state === 'open' && !this.form.controls.name.dirty) this.form.controls.name.setValue(invitation.name);
      this.view.set({ kind: invitation.state, invitation });
    } catch (error) {
      const problem = toProblem(error);
      this.view.set(problem.status === 404 || problem.status === 400 ? { kind: 'unknown' } : { kind: 'unreachable', problem });
    }
  }

  /** Creates the account with the chosen name and password, signs in and goes to the models. */
  async accept(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.busy.set(true);
    this.refusal.set(null);
    try {
      const { name, password } = this.form.getRawValue();
      const created = await firstValueFrom(this.invitations.accept(this.token(), { name: name.trim(), password }));
      const me = await this.session.adopt(created.token);
      await this.router.navigateByUrl('/models');
      this.notices.done(`Welcome to Polewright, ${me.user.name}: you are signed in as ${me.user.role}.`);
    } catch (error) {
      const problem = toProblem(error);
      if (problem.status === 409) {
        await this.load();
        return;
      }
      if (problem.status === 404) {
        this.view.set({ kind: 'unknown' });
        return;
      }
      const unplaced = showProblemOnForm(this.form, problem);
      if (!problem.hasFieldErrors || unplaced.length > 0) this.refusal.set(problem.detail || problem.title);
    } finally {
      this.busy.set(false);
    }
  }
}
