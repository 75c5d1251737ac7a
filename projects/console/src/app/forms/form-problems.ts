import type { AbstractControl } from '@angular/forms';
import type { ApiProblem, FieldProblem } from '../problem/api-problem';

/** Finds the control a JSON Pointer of the API names (null when the form has no such field). */
export type PointerLocator = (pointer: string) => AbstractControl | null;

/** The default locator: pointer segments are control names (`/plant/expression` → plant.expression). */
export function controlAtPointer(form: AbstractControl): PointerLocator {
  return (pointer) => {
    const path = pointer
      .split('/')
      .slice(1)
      .map((segment) => segment.replace(/~1/g, '/').replace(/~0/g, '~'));
    if (path.length === 0) return null;
    return form.get(path);
  };
}

/**
 * Puts the API's field errors on the form's controls (error key `server`, the API's own words), marks
 * them touched so that they show at once, and returns the errors no control could take (for a summary
 * above the form). The next edit of a field re-runs its validators, which clears the server's message.
 */
export function showProblemOnForm(form: AbstractControl, problem: Pick<ApiProblem, 'errors'>, locate: PointerLocator = controlAtPointer(form)): FieldProblem[] {
  const unplaced: FieldProblem[] = [];
  for (const error of problem.errors) {
    const control = locate(error.pointer);
    if (!control) {
      unplaced.push(error);
      continue;
    }
    control.setErrors({ ...(control.errors ?? {}), server: error.detail });
    control.markAsTouched();
  }
  return unplaced;
}
