import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** Expiry presets of a new key, in days from today. */
export const EXPIRY_PRESETS: readonly { readonly days: number; readonly label: string }[] = [
  { days: 30, label: '30 days' },
  { days: 90, label: '90 days' },
  { days: 365, label: '1 year' },
];

/** Local midnight of a day (the calendar's dates are local days). */
export function startOfDay(date: Date): Date {
  return new Date(date.getFullYear(), date.getMonth(), date.getDate());
}

/** The day `days` days after `from`'s day (local calendar, so daylight-saving changes do not shift it). */
export function daysFrom(from: Date, days: number): Date {
  return new Date(from.getFullYear(), from.getMonth(), from.getDate() + days);
}

/** The moment a key picked for a day expires: the last millisecond of that local day. */
export function endOfDay(day: Date): Date {
  return new Date(day.getFullYear(), day.getMonth(), day.getDate(), 23, 59, 59, 999);
}

/**
 * Validator factory: the picked day must come after today (a key has to expire in the future; the API
 * checks again). Empty means "no expiry" and is valid. `today` is read at each check.
 */
export function afterToday(today: () => Date = () => new Date()): (control: AbstractControl<Date | null>) => ValidationErrors | null {
  return (control) => {
    const value = control.value;
    if (value === null || value === undefined) return null;
    if (!(value instanceof Date) || Number.isNaN(value.getTime())) return { notDate: { message: 'Not a date: use the calendar or the form of the example.' } };
    return startOfDay(value).getTime() > startOfDay(today()).getTime() ? null : { notFuture: { message: 'Pick a day after today: a key must expire in the future.' } };
  };
}
