import type { components } from '@polewright/api-types';

/**
 * The REST API's schemas, generated from openapi/openapi.yaml by `npm run gen:api` (openapi-typescript):
 * the console types every request and answer with them, so a change of the contract breaks its build.
 */
export type Schemas = components['schemas'];

export type Model = Schemas['Model'];
export type ModelInput = Schemas['ModelInput'];
export type ModelPage = Schemas['ModelPage'];
export type Plant = Schemas['Plant'];
export type Compensator = Schemas['Compensator'];
export type Complex = Schemas['Complex'];
export type DesignTargets = Schemas['DesignTargets'];
export type RevisionSummary = Schemas['RevisionSummary'];
export type Revision = Schemas['Revision'];
export type Me = Schemas['Me'];
export type User = Schemas['User'];
export type Role = Schemas['Role'];
export type Scope = Schemas['Scope'];
export type Problem = Schemas['Problem'];
export type Health = Schemas['Health'];

/** Every permission the API knows (`Me.permissions`). */
export type Permission = Me['permissions'][number];

/** One page of a paged list (`items`, `total`, `page`, `pageSize`). */
export interface Paged<T> {
  readonly items: T[];
  readonly total: number;
  readonly page: number;
  readonly pageSize: number;
}
