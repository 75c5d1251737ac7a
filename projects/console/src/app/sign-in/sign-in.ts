import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { toProblem } from '../problem/api-problem';
import { Session } from '../session/session';

/** Where to go after signing in: a path inside the console, never another site. */
export function safeReturnUrl(url: string | null | undefined): string {
  if (!url || !url.startsWith('/') || url.startsWith('//') || url.startsWith('/sign-in')) return '/models';
  return url;
}

/** The sign-in page: e-mail and password, the API's refusal shown above the form. */
@Component({
  selector: 'pwc-sign-in',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule, FieldMessagePipe],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  host: { class: 'pwc-lone-page' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  /** Where the person was going (query parameter). */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly busy = signal(false);
  protected readonly refusal = signal<string | null>(null);
  protected readonly showPassword = signal(false);

  /** Signs in with the form's e-mail and password. */
  async signIn(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.busy.set(true);
    this.refusal.set(null);
    try {
      const { email, password } = this.form.getRawValue();
      await this.session.signIn(email.trim(), password);
      await this.router.navigateByUrl(safeReturnUrl(this.returnUrl()));
    } catch (error) {
      const problem = toProblem(error);
      const unplaced = showProblemOnForm(this.form, problem);
      if (!problem.hasFieldErrors || unplaced.length > 0) this.refusal.set(problem.detail || problem.title);
    } finally {
      this.busy.set(false);
    }
  }
}
