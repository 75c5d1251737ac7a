import type { Model, Revision, RevisionSummary } from '../api/api-types';

// Test data for the model screens' specs (invented: the demo company's line 3 belt loop), never used by the app.

const EMIL = { id: 'u-emil', email: 'emil.engineer@quillfield.example', name: 'Emil Varga-Lund' };

/** A model as `GET /models/{id}` answers it, with fields overridden. */
export function aModel(overrides: Partial<Model> = {}): Model {
  return {
    id: '7b1c6f0e-0000-4000-8000-000000000001',
    name: 'Line 3 belt speed (PI + drive)',
    description: 'Speed loop of the main belt drive on packing line 3.',
    tags: ['conveyor', 'speed'],
    plant: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' },
    compensator: null,
    design: { gain: 4, targets: null },
    revision: 1,
    createdAt: '2026-12-01T08:00:00.000Z',
    updatedAt: '2026-12-01T08:00:00.000Z',
    createdBy: EMIL,
    updatedBy: EMIL,
    deletedAt: null,
    ...overrides,
  };
}

/** A revision summary as `GET /models/{id}/revisions` lists it. */
export function aRevisionSummary(revision: number, overrides: Partial<RevisionSummary> = {}): RevisionSummary {
  return { revision, comment: `save ${revision}`, createdAt: `2026-12-0${revision}T09:00:00.000Z`, author: EMIL, contentHash: `${String(revision).repeat(8)}abcdef`.padEnd(64, '0'), ...overrides };
}

/** A full revision as `GET /models/{id}/revisions/{n}` answers it. */
export function aRevision(revision: number, content: Partial<Revision> = {}): Revision {
  const model = aModel();
  return {
    ...aRevisionSummary(revision),
    modelId: model.id,
    name: model.name,
    description: model.description,
    tags: model.tags,
    plant: model.plant,
    compensator: model.compensator,
    design: model.design,
    ...content,
  };
}
