import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { FieldMessagePipe } from '../forms/field-message';
import { showProblemOnForm } from '../forms/form-problems';
import { PageHeader } from '../layout/page-header';
import { toProblem } from '../problem/api-problem';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { AccountApi } from './account-api';

/** Whether the two new-password fields agree. */
export function passwordsMatch(group: AbstractControl): ValidationErrors | null {
  const next = group.get('newPassword')?.value as string | undefined;
  const again = group.get('confirmPassword');
  if (!again || !next || again.value === next) {
    if (again?.hasError('mismatch')) again.setErrors(null);
    return null;
  }
  again.setErrors({ mismatch: { message: 'The two new passwords differ.' } });
  return null;
}

/** "My account": who I am, my role and permissions, my session; change my name or password. */
@Component({
  selector: 'pwc-account',
  imports: [ReactiveFormsModule, DatePipe, PageHeader, MatCardModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatChipsModule, FieldMessagePipe],
  templateUrl: './account.html',
  styleUrl: './account.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Account {
  private readonly api = inject(AccountApi);
  private readonly notices = inject(Notices);
  protected readonly session = inject(Session);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly nameForm = this.fb.group({ name: [this.session.me()?.user.name ?? '', [Validators.required, Validators.maxLength(120)]] });
  protected readonly passwordForm = this.fb.group(
    {
      currentPassword: ['', Validators.required],
      newPassword: ['', [Validators.required, Validators.minLength(10), Validators.maxLength(200)]],
      confirmPassword: ['', Validators.required],
    },
    { validators: passwordsMatch },
  );
  protected readonly savingName = signal(false);
  protected readonly savingPassword = signal(false);

  /** Saves a new display name. */
  async saveName(): Promise<void> {
    this.nameForm.markAllAsTouched();
    if (this.nameForm.invalid) return;
    this.savingName.set(true);
    try {
      this.session.update(await firstValueFrom(this.api.change({ name: this.nameForm.getRawValue().name.trim() })));
      this.nameForm.markAsPristine();
      this.notices.done('Name saved');
    } catch (error) {
      showProblemOnForm(this.nameForm, toProblem(error));
    } finally {
      this.savingName.set(false);
    }
  }

  /** Changes the password (the current one is checked by the API); other sessions end. */
  async savePassword(): Promise<void> {
    this.passwordForm.markAllAsTouched();
    if (this.passwordForm.invalid) return;
    this.savingPassword.set(true);
    try {
      const { currentPassword, newPassword } = this.passwordForm.getRawValue();
      this.session.update(await firstValueFrom(this.api.change({ currentPassword, newPassword })));
      this.passwordForm.reset();
      this.notices.done('Password changed; your other sessions were signed out');
    } catch (error) {
      showProblemOnForm(this.passwordForm, toProblem(error));
    } finally {
      this.savingPassword.set(false);
    }
  }
}
