import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { type AbstractControl, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { DatePipe } from '@angular/common';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import type { Scope } from '../api/api-types';
import { FieldMessagePipe, fieldMessage } from '../forms/field-message';
import { controlAtPointer, showProblemOnForm } from '../forms/form-problems';
import { problemSummary, toProblem } from '../problem/api-problem';
import { afterToday, daysFrom, endOfDay, EXPIRY_PRESETS } from './expiry';
import { orderedScopes, SCOPES } from './key-scopes';
import { type ApiKeyCreate, type ApiKeyCreated, KeysApi } from './keys-api';

/** At least one scope ticked (the API needs one or more). */
export function someScope(group: AbstractControl): ValidationErrors | null {
  const values = Object.values((group.value ?? {}) as Record<string, boolean>);
  return values.some(Boolean) ? null : { noScope: { message: 'Pick at least one scope.' } };
}

/**
 * "Issue key": name, scopes (each explained) and an optional expiry day (presets 30/90/365 days). Closes
 * with the issued key, secret included, which the list hands straight to the copy-once dialog.
 */
@Component({
  selector: 'pwc-issue-key-dialog',
  imports: [ReactiveFormsModule, DatePipe, MatDialogModule, MatButtonModule, MatCheckboxModule, MatDatepickerModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressBarModule, FieldMessagePipe],
  providers: [provideNativeDateAdapter()],
  templateUrl: './issue-key-dialog.html',
  styleUrl: './issue-key-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IssueKeyDialog {
  private readonly api = inject(KeysApi);
  private readonly ref = inject<MatDialogRef<IssueKeyDialog, ApiKeyCreated>>(MatDialogRef);

  protected readonly scopes = SCOPES;
  protected readonly presets = EXPIRY_PRESETS;
  /** The first day a key may expire on (tomorrow). */
  protected readonly firstDay = daysFrom(new Date(), 1);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120), notBlank]],
    scopes: new FormGroup(Object.fromEntries(SCOPES.map((s) => [s.scope, new FormControl(false, { nonNullable: true })])) as Record<Scope, FormControl<boolean>>, { validators: someScope }),
    expiresOn: new FormControl<Date | null>(null, { validators: afterToday() }),
  });
  protected readonly busy = signal(false);
  /** Problems the API gave for no field of this form. */
  protected readonly problem = signal<string | null>(null);

  /** Sets the expiry to a day `days` from today. */
  pickPreset(days: number): void {
    this.form.controls.expiresOn.setValue(daysFrom(new Date(), days));
    this.form.controls.expiresOn.markAsTouched();
  }

  /** Clears the expiry: the key works until revoked. */
  clearExpiry(): void {
    this.form.controls.expiresOn.setValue(null);
  }

  /** The message under the expiry field (the datepicker's own parse and minimum errors worded plainly). */
  protected expiryMessage(): string {
    const errors = this.form.controls.expiresOn.errors;
    if (errors?.['matDatepickerParse']) return 'Not a date: pick one in the calendar.';
    if (errors?.['matDatepickerMin']) return 'Pick a day after today: a key must expire in the future.';
    return fieldMessage(errors);
  }

  /** The moment the key will expire (end of the picked day), or null for none. */
  protected expiresAt(): Date | null {
    const day = this.form.controls.expiresOn.value;
    return day instanceof Date && !Number.isNaN(day.getTime()) ? endOfDay(day) : null;
  }

  /** The request body for the form's values. */
  protected body(): ApiKeyCreate {
    const { name, scopes } = this.form.getRawValue();
    const body: ApiKeyCreate = { name: name.trim(), scopes: orderedScopes(SCOPES.map((s) => s.scope).filter((s) => scopes[s])) };
    const expiresAt = this.expiresAt();
    return expiresAt ? { ...body, expiresAt: expiresAt.toISOString() } : body;
  }

  /** Issues the key and closes with it; the API's field errors land at the fields. */
  async issue(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.busy()) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      this.ref.close(await firstValueFrom(this.api.issue(this.body())));
    } catch (error) {
      const problem = toProblem(error);
      const toField = controlAtPointer(this.form);
      const unplaced = showProblemOnForm(this.form, problem, (pointer) => (pointer === '/expiresAt' ? this.form.controls.expiresOn : pointer.startsWith('/scopes') ? this.form.controls.scopes : toField(pointer)));
      if (!problem.hasFieldErrors || unplaced.length > 0) this.problem.set([problemSummary(problem), ...unplaced.map((e) => `${e.pointer}: ${e.detail}`)].join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}

/** A name of only spaces is no name. */
function notBlank(control: AbstractControl<string>): ValidationErrors | null {
  return typeof control.value === 'string' && control.value.length > 0 && control.value.trim() === '' ? { blank: { message: 'Required.' } } : null;
}
