import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import { type ApplicationConfig, inject, provideAppInitializer, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { provideRouter, TitleStrategy, withComponentInputBinding, withInMemoryScrolling } from '@angular/router';
import { problemInterceptor } from './problem/problem-interceptor';
import { routes } from './app.routes';
import { authInterceptor } from './session/auth-interceptor';
import { Session } from './session/session';
import { ServerHealth } from './server-info/server-health';
import { ConsoleTitle } from './shell/console-title';

/** The console's providers: zoneless change detection, the router, HttpClient with the two interceptors. */
export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding(), withInMemoryScrolling({ scrollPositionRestoration: 'top' })),
    // the bearer token goes on first; problems are read on the way back
    provideHttpClient(withFetch(), withInterceptors([authInterceptor, problemInterceptor])),
    { provide: TitleStrategy, useClass: ConsoleTitle },
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } },
    provideAppInitializer(() => Promise.all([inject(Session).restore(), inject(ServerHealth).load()]).then(() => undefined)),
  ],
};
