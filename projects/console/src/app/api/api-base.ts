import { InjectionToken } from '@angular/core';

/** Base path of the REST API's version 1 (same origin: the API server serves the console). */
export const API_V1 = new InjectionToken<string>('API_V1', { factory: () => '/api/v1' });

/** Base path handed to the pw- elements (`api-base`): the elements add `/v1/…` themselves. */
export const API_ROOT = '/api';

/** Turns a filter object into query parameters, leaving out empty values (undefined, null, ''). */
export function queryParams(values: Record<string, string | number | boolean | null | undefined>): Record<string, string> {
  const params: Record<string, string> = {};
  for (const [key, value] of Object.entries(values)) {
    if (value === undefined || value === null || value === '') continue;
    params[key] = String(value);
  }
  return params;
}
