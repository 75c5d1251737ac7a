import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { createEnvironmentInjector, EnvironmentInjector, inject, InjectionToken } from '@angular/core';
import { problemInterceptor } from '../problem/problem-interceptor';
import { authInterceptor } from '../session/auth-interceptor';

/**
 * An HttpClient on XMLHttpRequest, for uploads that show their progress: the console's own client uses
 * fetch() (`withFetch()` in app.config.ts), which reports no upload progress. Same interceptors as the
 * console's client (bearer token, problem handling). Specs replace it with the testing client.
 */
export const UPLOAD_HTTP = new InjectionToken<HttpClient>('UPLOAD_HTTP', {
  providedIn: 'root',
  factory: () => createEnvironmentInjector([provideHttpClient(withInterceptors([authInterceptor, problemInterceptor]))], inject(EnvironmentInjector)).get(HttpClient),
});
