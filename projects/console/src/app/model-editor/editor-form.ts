import { type AbstractControl, FormArray, FormControl, FormGroup, type ValidationErrors, type ValidatorFn, Validators } from '@angular/forms';
import type { Model, Revision } from '../api/api-types';
import { coefficientList } from './coefficients';
import type { DiffField } from './conflict-diff';
import { type ComplexEntry, DEFAULT_PADE, emptyPlantFields, hasDeadTime, type PlantFields, plantFieldsOf, type PlantFormKind } from './plant-body';

/** Limits of the editable fields: the contract's (`ModelInput`, `Tags`). */
export const LIMITS = { name: 120, description: 4000, tags: 20, tagLength: 40, comment: 500, expression: 4000 } as const;

/** The tag rule of the API: lowercase words of a–z and 0–9 joined by single hyphens. */
export const TAG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** One pole or zero row. */
export type ComplexRow = FormGroup<{ re: FormControl<number | null>; im: FormControl<number | null> }>;

/** The plant part of the form; control names are the `plant` body's field names, so API pointers find them. */
export type PlantGroup = FormGroup<{
  form: FormControl<PlantFormKind>;
  expression: FormControl<string>;
  numerator: FormControl<string>;
  denominator: FormControl<string>;
  zeros: FormArray<ComplexRow>;
  poles: FormArray<ComplexRow>;
  gain: FormControl<number | null>;
  domain: FormControl<'s' | 'z'>;
  sampleTime: FormControl<number | null>;
  deadTime: FormControl<number | null>;
  padeOrder: FormControl<number | null>;
  discretize: FormGroup<{ enabled: FormControl<boolean>; sampleTime: FormControl<number | null> }>;
}>;

/** The model editor's form; control names follow `ModelInput`, so `/name`, `/tags/0`, `/plant/…` pointers land. */
export type EditorForm = FormGroup<{
  name: FormControl<string>;
  description: FormControl<string>;
  tags: FormControl<string[]>;
  comment: FormControl<string>;
  plant: PlantGroup;
}>;

/** What the editor edits of a model (compensator and design are kept as loaded). */
export interface EditorValue {
  readonly name: string;
  readonly description: string;
  readonly tags: readonly string[];
  readonly plant: PlantFields;
}

/** Validator: text that is not only spaces (the API trims). */
export const notBlank: ValidatorFn = (control) => (typeof control.value === 'string' && control.value.trim() === '' && control.value !== '' ? { blank: { message: 'Must not be only spaces.' } } : null);

/** Validator: a number above zero (seconds). */
export const positive: ValidatorFn = (control) => (typeof control.value === 'number' && !(control.value > 0) ? { positive: { message: 'Must be a positive number of seconds.' } } : null);

/** Validator: a finite number other than zero (the gain of the factored form). */
export const nonZero: ValidatorFn = (control) => (control.value === 0 ? { nonZero: { message: 'Must not be zero.' } } : null);

/** Validator of the tag list: at most 20 tags, each following the API's rule. */
export const tagList: ValidatorFn = (control: AbstractControl): ValidationErrors | null => {
  const tags = (control.value ?? []) as string[];
  if (tags.length > LIMITS.tags) return { tags: { message: `At most ${LIMITS.tags} tags.` } };
  const bad = tags.find((t) => !TAG_PATTERN.test(t) || t.length > LIMITS.tagLength);
  return bad === undefined ? null : { tags: { message: `"${bad}" is not a tag: lowercase words joined by hyphens (a–z, 0–9), at most ${LIMITS.tagLength} characters.` } };
};

/** A pole or zero row: the real part is required, the imaginary part defaults to 0. */
export function complexRow(value: ComplexEntry = { re: null, im: 0 }): ComplexRow {
  return new FormGroup({
    re: new FormControl<number | null>(value.re, Validators.required),
    im: new FormControl<number | null>(value.im ?? 0),
  });
}

/** A fresh, empty editor form (expression form, continuous time). */
export function editorForm(): EditorForm {
  const plant = emptyPlantFields();
  const form: EditorForm = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, notBlank, Validators.maxLength(LIMITS.name)] }),
    description: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(LIMITS.description)] }),
    tags: new FormControl<string[]>([], { nonNullable: true, validators: [tagList] }),
    comment: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(LIMITS.comment)] }),
    plant: new FormGroup({
      form: new FormControl<PlantFormKind>(plant.form, { nonNullable: true }),
      expression: new FormControl('', { nonNullable: true, validators: [Validators.required, notBlank, Validators.maxLength(LIMITS.expression)] }),
      numerator: new FormControl('', { nonNullable: true, validators: [coefficientList] }),
      denominator: new FormControl('', { nonNullable: true, validators: [coefficientList] }),
      zeros: new FormArray<ComplexRow>([]),
      poles: new FormArray<ComplexRow>([]),
      gain: new FormControl<number | null>(1, [Validators.required, nonZero]),
      domain: new FormControl<'s' | 'z'>('s', { nonNullable: true }),
      sampleTime: new FormControl<number | null>(null, [Validators.required, positive]),
      deadTime: new FormControl<number | null>(null, [Validators.min(0)]),
      padeOrder: new FormControl<number | null>(DEFAULT_PADE, [Validators.required, Validators.min(1), Validators.max(10)]),
      discretize: new FormGroup({
        enabled: new FormControl(false, { nonNullable: true }),
        sampleTime: new FormControl<number | null>(null, [Validators.required, positive]),
      }),
    }),
  });
  syncEnabled(form.controls.plant);
  return form;
}

/**
 * Enables exactly the plant controls that take part, so that validity covers only them: the active form's
 * fields, the sampling period for sampled plants, the hold's period when chosen, the Padé order with dead time.
 */
export function syncEnabled(plant: PlantGroup): void {
  const c = plant.controls;
  const kind = c.form.value;
  const sampled = c.domain.value === 'z';
  const hold = !sampled && c.discretize.controls.enabled.value;
  setEnabled(c.expression, kind === 'expression');
  setEnabled(c.numerator, kind === 'coefficients');
  setEnabled(c.denominator, kind === 'coefficients');
  setEnabled(c.zeros, kind === 'factored');
  setEnabled(c.poles, kind === 'factored');
  setEnabled(c.gain, kind === 'factored');
  setEnabled(c.sampleTime, sampled);
  setEnabled(c.discretize, !sampled);
  if (!sampled) setEnabled(c.discretize.controls.sampleTime, hold);
  setEnabled(c.padeOrder, !sampled && !hold && hasDeadTime({ deadTime: c.deadTime.value }));
}

function setEnabled(control: AbstractControl, enabled: boolean): void {
  if (enabled && control.disabled) control.enable({ emitEvent: false });
  if (!enabled && control.enabled) control.disable({ emitEvent: false });
}

/** Puts a plant's fields into the form (rows of poles and zeros rebuilt), without events. */
export function fillPlant(plant: PlantGroup, fields: PlantFields): void {
  const c = plant.controls;
  c.zeros.clear({ emitEvent: false });
  c.poles.clear({ emitEvent: false });
  for (const z of fields.zeros) c.zeros.push(complexRow(z), { emitEvent: false });
  for (const p of fields.poles) c.poles.push(complexRow(p), { emitEvent: false });
  c.form.setValue(fields.form, { emitEvent: false });
  c.expression.setValue(fields.expression, { emitEvent: false });
  c.numerator.setValue(fields.numerator, { emitEvent: false });
  c.denominator.setValue(fields.denominator, { emitEvent: false });
  c.gain.setValue(fields.gain, { emitEvent: false });
  c.domain.setValue(fields.domain, { emitEvent: false });
  c.sampleTime.setValue(fields.sampleTime, { emitEvent: false });
  c.deadTime.setValue(fields.deadTime, { emitEvent: false });
  c.padeOrder.setValue(fields.padeOrder ?? DEFAULT_PADE, { emitEvent: false });
  c.discretize.setValue({ enabled: fields.discretize.enabled, sampleTime: fields.discretize.sampleTime }, { emitEvent: false });
  syncEnabled(plant);
  plant.updateValueAndValidity();
}

/** Puts a model (or one of its revisions) into the form and marks it pristine; the comment is emptied. */
export function fillForm(form: EditorForm, model: EditorValue | Model | Revision): void {
  const value = 'revision' in model ? editorValueOf(model) : model;
  form.controls.name.setValue(value.name, { emitEvent: false });
  form.controls.description.setValue(value.description, { emitEvent: false });
  form.controls.tags.setValue([...value.tags], { emitEvent: false });
  form.controls.comment.setValue('', { emitEvent: false });
  fillPlant(form.controls.plant, value.plant);
  form.markAsPristine();
  form.markAsUntouched();
  form.updateValueAndValidity();
}

/** What the form holds, as an EditorValue (every form's fields, as typed). */
export function formValueOf(form: EditorForm): EditorValue {
  const raw = form.getRawValue();
  return { name: raw.name, description: raw.description, tags: raw.tags, plant: raw.plant as PlantFields };
}

/** The EditorValue of a stored model or revision. */
export function editorValueOf(model: Model | Revision): EditorValue {
  return { name: model.name, description: model.description, tags: [...model.tags], plant: plantFieldsOf(model.plant) };
}

/** Copies one field (as the conflict panel groups them) of another value into the form, with events. */
export function copyField(form: EditorForm, field: DiffField, from: EditorValue): void {
  const c = form.controls;
  const mine = c.plant.getRawValue() as PlantFields;
  const theirs = from.plant;
  switch (field) {
    case 'name':
    case 'description':
      c[field].setValue(from[field]);
      break;
    case 'tags':
      c.tags.setValue([...from.tags]);
      break;
    case 'plant':
      fillPlant(c.plant, { ...mine, form: theirs.form, expression: theirs.expression, numerator: theirs.numerator, denominator: theirs.denominator, zeros: theirs.zeros, poles: theirs.poles, gain: theirs.gain });
      break;
    case 'domain':
      fillPlant(c.plant, { ...mine, domain: theirs.domain, sampleTime: theirs.sampleTime });
      break;
    case 'discretize':
      fillPlant(c.plant, { ...mine, discretize: theirs.discretize });
      break;
    default:
      fillPlant(c.plant, { ...mine, [field]: theirs[field] });
  }
  form.markAsDirty();
}
