import { Injectable } from '@angular/core';
import type { AbstractControl, FormGroupDirective, NgForm } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';

/**
 * Shows a field's error as soon as it is typed into (dirty), not only after leaving it (touched), so that
 * a coefficient that is not a number or an expression the engine refuses is marked while typing.
 */
@Injectable()
export class LiveErrors implements ErrorStateMatcher {
  isErrorState(control: AbstractControl | null, form: FormGroupDirective | NgForm | null): boolean {
    return !!control && control.invalid && (control.dirty || control.touched || !!form?.submitted);
  }
}
