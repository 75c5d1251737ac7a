import { EntitySchema } from 'typeorm';

/** A row of `model_revisions`: one immutable saved version of a model. */
export interface ModelRevisionRow {
  model_id: string;
  revision: number;
  name: string;
  description: string;
  tags: string;
  /** The core's plant form as JSON. */
  plant: string;
  /** `{ zeros, poles, gain }` as JSON, or null. */
  compensator: string | null;
  /** `{ gain, targets }` as JSON. */
  design: string;
  comment: string;
  author_id: string | null;
  created_at: string;
  content_hash: string;
}

/** Table `model_revisions`: primary key (model_id, revision), so a revision number can never be written twice. */
export const ModelRevisionEntity = new EntitySchema<ModelRevisionRow>({
  name: 'ModelRevision',
  tableName: 'model_revisions',
  columns: {
    model_id: { type: 'varchar', length: 36, primary: true },
    revision: { type: 'integer', primary: true },
    name: { type: 'varchar', length: 120 },
    description: { type: 'text' },
    tags: { type: 'text' },
    plant: { type: 'text' },
    compensator: { type: 'text', nullable: true },
    design: { type: 'text' },
    comment: { type: 'text', default: '' },
    author_id: { type: 'varchar', length: 36, nullable: true },
    created_at: { type: 'varchar', length: 30 },
    content_hash: { type: 'varchar', length: 64 },
  },
});
