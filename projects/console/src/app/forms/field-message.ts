import { Pipe, type PipeTransform } from '@angular/core';
import type { AbstractControl, ValidationErrors } from '@angular/forms';

/**
 * The message to show under a field for its first error: the API's own words (`server`), a validator's
 * `message`, or a plain sentence for Angular's built-in validators.
 */
export function fieldMessage(errors: ValidationErrors | null | undefined): string {
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return errors['server'];
  for (const [key, value] of Object.entries(errors)) {
    const info = (value ?? {}) as Record<string, unknown>;
    if (typeof info['message'] === 'string') return info['message'];
    switch (key) {
      case 'required':
        return 'Required.';
      case 'email':
        return 'Not an e-mail address.';
      case 'min':
        return `At least ${String(info['min'])}.`;
      case 'max':
        return `At most ${String(info['max'])}.`;
      case 'minlength':
        return `At least ${String(info['requiredLength'])} characters.`;
      case 'maxlength':
        return `At most ${String(info['requiredLength'])} characters.`;
      case 'pattern':
        return 'Not in the expected form.';
      default:
        return 'Not valid.';
    }
  }
  return '';
}

/** `control | fieldMessage`: the message for a control's current errors (re-read on every check). */
@Pipe({ name: 'fieldMessage', pure: false })
export class FieldMessagePipe implements PipeTransform {
  transform(control: AbstractControl | null | undefined): string {
    return fieldMessage(control?.errors);
  }
}
