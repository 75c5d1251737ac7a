import { type AbstractControl, FormControl, FormGroup, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { DesignTargets } from '../api/api-types';

/** The targets panel's form: the API's `DesignTargets` under `targets`, plus the "dominant pair only" switch. */
export type DesignForm = FormGroup<{
  targets: FormGroup<{
    minDampingRatio: FormControl<number | null>;
    maxSettlingTime: FormControl<number | null>;
    maxOvershootPct: FormControl<number | null>;
    naturalFrequency: FormGroup<{ min: FormControl<number | null>; max: FormControl<number | null> }>;
  }>;
  dominantOnly: FormControl<boolean>;
}>;

/** The form's raw value. */
export type DesignFormValue = ReturnType<DesignForm['getRawValue']>;

/** A number strictly between `low` and `high` (empty passes: the target is optional). */
export function openInterval(low: number, high: number, message: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const value = control.value as number | null;
    if (value === null || value === undefined) return null;
    return typeof value === 'number' && Number.isFinite(value) && value > low && value < high ? null : { range: { message } };
  };
}

/** A number of at least `low` (empty passes). */
export function atLeast(low: number, message: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const value = control.value as number | null;
    if (value === null || value === undefined) return null;
    return typeof value === 'number' && Number.isFinite(value) && value >= low ? null : { range: { message } };
  };
}

/** ωn min below ωn max, checked on the min field (where the API puts the same complaint). */
function belowBandMax(control: AbstractControl): ValidationErrors | null {
  const min = control.value as number | null;
  const max = control.parent?.get('max')?.value as number | null | undefined;
  if (min === null || max === null || max === undefined) return null;
  return min < max ? null : { band: { message: 'Must be below ωn max.' } };
}

/**
 * The form of the targets panel, its validators mirroring the contract (`DesignTargets`: ζ in (0, 1),
 * settling time > 0 s, overshoot in (0, 100) %, ωn min ≥ 0 below ωn max > 0). Control names follow the
 * request body, so the API's pointers (`/targets/minDampingRatio`) find their fields.
 */
export function designForm(): DesignForm {
  const form: DesignForm = new FormGroup({
    targets: new FormGroup({
      minDampingRatio: new FormControl<number | null>(null, openInterval(0, 1, 'Between 0 and 1, both excluded.')),
      maxSettlingTime: new FormControl<number | null>(null, openInterval(0, Infinity, 'More than 0 s.')),
      maxOvershootPct: new FormControl<number | null>(null, openInterval(0, 100, 'Between 0 and 100 %, both excluded.')),
      naturalFrequency: new FormGroup({
        min: new FormControl<number | null>(null, [atLeast(0, '0 rad/s or more.'), belowBandMax]),
        max: new FormControl<number | null>(null, openInterval(0, Infinity, 'More than 0 rad/s.')),
      }),
    }),
    dominantOnly: new FormControl(false, { nonNullable: true }),
  });
  const band = form.controls.targets.controls.naturalFrequency.controls;
  // the min field's check reads max: run it again when max changes
  band.max.valueChanges.subscribe(() => band.min.updateValueAndValidity({ emitEvent: false }));
  return form;
}

const present = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

/** The targets a form value asks for (only the fields given), or null when none is given. */
export function targetsOf(value: DesignFormValue['targets']): DesignTargets | null {
  const targets: DesignTargets = {};
  if (present(value.minDampingRatio)) targets.minDampingRatio = value.minDampingRatio;
  if (present(value.maxSettlingTime)) targets.maxSettlingTime = value.maxSettlingTime;
  if (present(value.maxOvershootPct)) targets.maxOvershootPct = value.maxOvershootPct;
  const { min, max } = value.naturalFrequency;
  if (present(min) || present(max)) {
    targets.naturalFrequency = {};
    if (present(min)) targets.naturalFrequency.min = min;
    if (present(max)) targets.naturalFrequency.max = max;
  }
  return Object.keys(targets).length ? targets : null;
}

/** The form value showing saved targets (empty fields for those not set). */
export function formValueOf(targets: DesignTargets | null | undefined, dominantOnly = false): DesignFormValue {
  return {
    targets: {
      minDampingRatio: targets?.minDampingRatio ?? null,
      maxSettlingTime: targets?.maxSettlingTime ?? null,
      maxOvershootPct: targets?.maxOvershootPct ?? null,
      naturalFrequency: { min: targets?.naturalFrequency?.min ?? null, max: targets?.naturalFrequency?.max ?? null },
    },
    dominantOnly,
  };
}

/** Whether two sets of targets ask for the same thing (null and `{}` alike). */
export function sameTargets(a: DesignTargets | null | undefined, b: DesignTargets | null | undefined): boolean {
  return JSON.stringify(targetsOf(formValueOf(a).targets)) === JSON.stringify(targetsOf(formValueOf(b).targets));
}

/**
 * The damping ratio a maximum overshoot stands for, through the second-order relation
 * ζ = −ln(OS)/√(π² + ln²(OS)) — the one the engine applies (projects/locus-core design/targets.ts; a standard
 * second-order approximation, recalled from memory). Example: 5 % → ζ ≈ 0.690.
 */
export function dampingFromOvershoot(overshootPct: number): number {
  const l = Math.log(overshootPct / 100);
  return -l / Math.sqrt(Math.PI * Math.PI + l * l);
}
