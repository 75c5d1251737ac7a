/*
 * The Polewright console: the Angular Material host application served by the API server at `/`.
 * Every piece of data comes from the REST API (`/api/v1`) through the services under `app/`.
 */
import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';

bootstrapApplication(App, appConfig).catch((error: unknown) => console.error('polewright console: could not start', error));
