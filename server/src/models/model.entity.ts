import { EntitySchema } from 'typeorm';

/** A row of `models`: the current state of a loop model (its content lives in `model_revisions`). */
export interface ModelRow {
  id: string;
  name: string;
  description: string;
  /** JSON array of tags. */
  tags: string;
  revision: number;
  created_at: string;
  updated_at: string;
  created_by: string | null;
  updated_by: string | null;
  deleted_at: string | null;
}

/** Table `models`: one row per loop model; `revision` is the current revision number (the ETag). */
export const ModelEntity = new EntitySchema<ModelRow>({
  name: 'Model',
  tableName: 'models',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    name: { type: 'varchar', length: 120 },
    description: { type: 'text', default: '' },
    tags: { type: 'text', default: '[]' },
    revision: { type: 'integer' },
    created_at: { type: 'varchar', length: 30 },
    updated_at: { type: 'varchar', length: 30 },
    created_by: { type: 'varchar', length: 36, nullable: true },
    updated_by: { type: 'varchar', length: 36, nullable: true },
    deleted_at: { type: 'varchar', length: 30, nullable: true },
  },
  indices: [
    { name: 'IDX_models_updated_at', columns: ['updated_at'] },
    { name: 'IDX_models_name', columns: ['name'] },
  ],
});
