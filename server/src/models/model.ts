import type { Compensator, DesignTargets, Plant } from '@polewright/locus-core';

/** The compensator in series with the plant (zeros, poles and gain in the loop's domain): the core's form. */
export type { Compensator } from '@polewright/locus-core';

/** The gain chosen for a loop and the targets it was chosen against. */
export interface ModelDesign {
  readonly gain: number | null;
  readonly targets: DesignTargets | null;
}

/** What a revision holds: everything an engineer edits about a loop. */
export interface ModelContent {
  readonly name: string;
  readonly description: string;
  readonly tags: readonly string[];
  readonly plant: Plant;
  readonly compensator: Compensator | null;
  readonly design: ModelDesign;
}

/** A checked create or update request: the content plus the revision comment. */
export interface ModelInput extends ModelContent {
  readonly comment: string;
}

/** Who made a change, as shown next to it. */
export interface Person {
  readonly id: string;
  readonly email: string;
  readonly name: string;
}

/** The model resource served over HTTP (see CONTRACTS.md). */
export interface Model extends ModelContent {
  readonly id: string;
  readonly revision: number;
  readonly createdAt: string;
  readonly updatedAt: string;
  readonly createdBy: Person | null;
  readonly updatedBy: Person | null;
  readonly deletedAt: string | null;
}

/** One entry of a model's history (without its content). */
export interface RevisionSummary {
  readonly revision: number;
  readonly comment: string;
  readonly createdAt: string;
  readonly author: Person | null;
  /** SHA-256 of the canonical plant + compensator content (the locus cache key). */
  readonly contentHash: string;
}

/** One revision with its full content, for reading an old version or diffing two. */
export interface Revision extends RevisionSummary, ModelContent {
  readonly modelId: string;
}

/** Sort keys of the model list. */
export type ModelSort = 'name' | 'updatedAt' | 'createdAt';

/** Query of the model list. */
export interface ModelQuery {
  readonly q?: string;
  readonly tag?: string;
  readonly sort: ModelSort;
  readonly order: 'asc' | 'desc';
  readonly page: number;
  readonly pageSize: number;
  readonly includeDeleted: boolean;
}

/** A page of the model list with the total count of matches. */
export interface ModelPage {
  readonly items: Model[];
  readonly total: number;
  readonly page: number;
  readonly pageSize: number;
}

/**
 * Strong ETag of a model revision: `"<id>-r<revision>"`, and `"<id>-r<revision>-deleted"` while the model is
 * soft-deleted, so that a cached copy is never revalidated (304) across a delete or a restore.
 */
export function etagOf(id: string, revision: number, deleted = false): string {
  return `"${id}-r${revision}${deleted ? '-deleted' : ''}"`;
}

/** `T` with every `readonly` removed, deeply (the generated OpenAPI types use mutable arrays). */
export type Writable<T> = T extends (infer U)[] ? Writable<U>[] : T extends readonly (infer U)[] ? Writable<U>[] : T extends object ? { -readonly [K in keyof T]: Writable<T[K]> } : T;

/**
 * The same value typed as `Writable<T>`, so that it can be checked against a generated OpenAPI type
 * (which differs from the core's types only in readonly-ness). Nothing is copied.
 */
export function writable<T>(value: T): Writable<T> {
  return value as Writable<T>;
}
