import { type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Session } from '../session/session';
import { Notices } from './notices';
import { HANDLED_STATUSES, SESSION_REQUIRED } from './problem-context';
import { toProblem } from './api-problem';

/**
 * Turns every failed API call into an `ApiProblem` (RFC 9457 title, detail and field errors) and shows it
 * in a snackbar, unless the caller said it shows that status itself. A 401 on a call that needs a session
 * means the session ended (expired, revoked, signed out in another tab): the console forgets it and
 * goes to the sign-in page, coming back here afterwards.
 */
export const problemInterceptor: HttpInterceptorFn = (request, next) => {
  const notices = inject(Notices);
  const session = inject(Session);
  const router = inject(Router);
  return next(request).pipe(
    catchError((error: unknown) => {
      const problem = toProblem(error);
      if (problem.status === 401 && request.context.get(SESSION_REQUIRED) && session.token()) {
        session.forget();
        notices.problem(problem);
        void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
      } else if (!request.context.get(HANDLED_STATUSES).includes(problem.status)) {
        notices.problem(problem);
      }
      return throwError(() => problem);
    }),
  );
};
