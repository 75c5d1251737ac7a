import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * Statuses whose problem the calling screen shows itself (e.g. 412 in the model editor's conflict panel,
 * 404 of an optional lookup): the interceptor still turns them into an `ApiProblem` but shows no snackbar.
 */
export const HANDLED_STATUSES = new HttpContextToken<readonly number[]>(() => []);

/** Whether a 401 of this request means "signed out" (false for the sign-in call itself). */
export const SESSION_REQUIRED = new HttpContextToken<boolean>(() => true);

/** An HttpContext saying that the caller shows problems of these statuses itself. */
export function handles(...statuses: number[]): HttpContext {
  return new HttpContext().set(HANDLED_STATUSES, statuses);
}
