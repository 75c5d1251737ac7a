import type { Model } from './model.js';

/** Name of the export format, checked on import. */
export const BUNDLE_FORMAT = 'polewright-models';
/** Version of the export format. */
export const BUNDLE_VERSION = 1;

/** One model in a bundle: its current content (ids are kept for reference only). */
export interface BundleEntry {
  readonly sourceId: string;
  readonly name: string;
  readonly description: string;
  readonly tags: readonly string[];
  readonly plant: Model['plant'];
  readonly compensator: Model['compensator'];
  readonly design: Model['design'];
  readonly comment: string;
}

/** The export file: what `POST /models/import` takes back. */
export interface ModelBundle {
  readonly format: typeof BUNDLE_FORMAT;
  readonly version: typeof BUNDLE_VERSION;
  readonly exportedAt: string;
  readonly models: BundleEntry[];
}

/** Builds the export bundle of these models at time `at`. */
export function toBundle(models: readonly Model[], at: Date): ModelBundle {
  return {
    format: BUNDLE_FORMAT,
    version: BUNDLE_VERSION,
    exportedAt: at.toISOString(),
    models: models.map((m) => ({
      sourceId: m.id,
      name: m.name,
      description: m.description,
      tags: m.tags,
      plant: m.plant,
      compensator: m.compensator,
      design: m.design,
      comment: `Imported from ${m.id} at revision ${m.revision}`,
    })),
  };
}
