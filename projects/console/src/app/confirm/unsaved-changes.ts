import type { CanDeactivateFn } from '@angular/router';

/** A screen that may hold work not saved yet. */
export interface LeaveCheck {
  /** Whether the person may leave now: true at once without unsaved work, otherwise their answer. */
  canLeave(): boolean | Promise<boolean>;
}

/** Route guard: asks the screen before leaving it (the screen asks the person when work is unsaved). */
export const unsavedChanges: CanDeactivateFn<LeaveCheck> = (screen) => screen?.canLeave?.() ?? true;
