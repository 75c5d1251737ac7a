import type { AbstractControl } from '@angular/forms';
import { loopPlant, normalizePlant, ValidationError, type Compensator, type FieldIssue, type Warning } from '@polewright/locus-core';
import type { Plant } from '../api/api-types';
import type { PointerLocator } from '../forms/form-problems';

/** The engine's verdict on a plant: the fields at fault (JSON Pointers as the API gives them) and its notes. */
export interface EngineVerdict {
  readonly issues: readonly FieldIssue[];
  readonly warnings: readonly Warning[];
}

/**
 * Runs the engine's own check on a plant, exactly as the API does on a save: `normalizePlant` at `/plant`,
 * then the whole loop (compensator × plant). The messages are the engine's words, so the field messages
 * shown while typing are the ones a save would get back.
 */
export function engineVerdict(plant: Plant, compensator: Compensator | null): EngineVerdict {
  let warnings: readonly Warning[];
  try {
    warnings = normalizePlant(plant, '/plant').warnings;
  } catch (error) {
    if (error instanceof ValidationError) return { issues: error.issues, warnings: [] };
    throw error;
  }
  if (compensator === null) return { issues: [], warnings };
  try {
    normalizePlant(loopPlant({ plant: plant as Parameters<typeof loopPlant>[0]['plant'], compensator }), '/plant');
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    // the API words a loop refusal this way (server/src/models/model-input.ts, checkLoop)
    return { issues: error.issues.map((i) => ({ pointer: '/compensator', detail: `makes the loop (compensator × plant) unusable: ${i.detail}` })), warnings };
  }
  return { issues: [], warnings };
}

/**
 * Finds the editor's control for an API or engine pointer: the deepest control on the pointer's path, so
 * `/plant/numerator/3` lands on the numerator field, `/tags/2` on the tag field and `/plant/zeros/1` on
 * that row. The form itself and the `plant` group are no field: such pointers stay unplaced (for the
 * summary above the form), as do `/compensator…` and `/design…`, which this editor does not edit.
 */
export function editorLocator(form: AbstractControl): PointerLocator {
  return (pointer) => {
    const path = pointer
      .split('/')
      .slice(1)
      .map((segment) => segment.replace(/~1/g, '/').replace(/~0/g, '~'));
    if (path[0] === 'plant' && path[1] === 'discretize') return form.get(['plant', 'discretize', 'sampleTime']);
    for (let length = path.length; length > 0; length--) {
      const prefix = path.slice(0, length);
      if (prefix.length === 1 && prefix[0] === 'plant') return null;
      const control = form.get(prefix);
      if (control) return control;
    }
    return null;
  };
}

/** The error key of the engine's live check on a control (apart from `server`, the API's answer to a save). */
export const ENGINE_ERROR = 'engine';

/** Removes the engine's messages from a control and everything under it (other errors stay). */
export function clearEngineErrors(control: AbstractControl): void {
  const children = 'controls' in control ? Object.values((control as unknown as { controls: Record<string, AbstractControl> }).controls) : [];
  for (const child of children) clearEngineErrors(child);
  if (!control.errors || !(ENGINE_ERROR in control.errors)) return;
  const { [ENGINE_ERROR]: _dropped, ...rest } = control.errors;
  control.setErrors(Object.keys(rest).length > 0 ? rest : null, { emitEvent: false });
}

/** Puts the engine's issues on their controls (error `engine` with the engine's words); returns those no field takes. */
export function placeEngineIssues(issues: readonly FieldIssue[], locate: PointerLocator): FieldIssue[] {
  const unplaced: FieldIssue[] = [];
  for (const issue of issues) {
    const control = locate(issue.pointer);
    if (!control) {
      unplaced.push(issue);
      continue;
    }
    const previous = control.errors?.[ENGINE_ERROR] as { message: string } | undefined;
    const message = previous ? `${previous.message}; ${issue.detail}` : issue.detail;
    control.setErrors({ ...(control.errors ?? {}), [ENGINE_ERROR]: { message } }, { emitEvent: false });
  }
  return unplaced;
}

/** Whether a control or anything under it has an error of its own validators (not the engine's, not the API's). */
export function hasOwnErrors(control: AbstractControl): boolean {
  if (control.disabled) return false;
  const children = 'controls' in control ? Object.values((control as unknown as { controls: Record<string, AbstractControl> }).controls) : [];
  if (children.some(hasOwnErrors)) return true;
  return Object.keys(control.errors ?? {}).some((key) => key !== ENGINE_ERROR && key !== 'server');
}
