import { type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Session } from './session';

/** Adds the session's bearer token to calls of the console's own API (never to other origins). */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const token = inject(Session).token();
  const ownApi = request.url.startsWith('/api/');
  if (!token || !ownApi || request.headers.has('Authorization')) return next(request);
  return next(request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }));
};
