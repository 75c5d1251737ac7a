/*
 * Loop models: list, read, create, update with optimistic concurrency, soft delete and restore, history.
 * No HTTP here: failures are the named errors of http/errors.ts.
 */
import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { ConflictError, NotFoundError, PreconditionFailedError, PreconditionRequiredError } from '../http/errors.js';
import { contentHash } from './content-hash.js';
import { etagOf, type Model, type ModelInput, type ModelPage, type ModelQuery, type Revision, type RevisionSummary } from './model.js';
import * as repository from './models.repository.js';

/** The resource form of a stored model (the content hash stays internal). */
export function toResource(record: repository.ModelRecord): Model {
  const { contentHash: _hash, ...model } = record;
  return model;
}

/** One page of the model list. */
export async function listModels(context: AppContext, query: ModelQuery): Promise<ModelPage> {
  const { items, total } = await repository.listModels(context.dataSource, query);
  return { items: items.map(toResource), total, page: query.page, pageSize: query.pageSize };
}

/** The tags in use on models that are not deleted, with their counts, sorted by tag. */
export async function listTags(context: AppContext): Promise<{ tag: string; count: number }[]> {
  return repository.listTags(context.dataSource);
}

/** A model by id; a deleted one only when `includeDeleted`. Throws `NotFoundError`. */
export async function getModel(context: AppContext, id: string, includeDeleted = false): Promise<Model> {
  const record = await repository.findModel(context.dataSource, id);
  if (!record || (record.deletedAt !== null && !includeDeleted)) throw new NotFoundError(`Model ${id}`);
  return toResource(record);
}

/** Creates a model with its first revision. */
export async function createModel(context: AppContext, input: ModelInput, actorId: string | null): Promise<Model> {
  const id = randomUUID();
  await inTransaction(context.dataSource, async (manager) => {
    await repository.insertModel(manager, id, revisionWrite(context, input, actorId));
    await recordAudit(context, { action: 'model.created', actorId, targetType: 'model', targetId: id, detail: { revision: 1, name: input.name } }, manager);
  });
  return getModel(context, id);
}

/**
 * Saves `input` as the next revision, provided `ifMatch` names the current one. The check and the write
 * are one conditional UPDATE inside one transaction, so two writers with the same ETag get one success and
 * one `PreconditionFailedError`, and no revision is lost. Throws `PreconditionRequiredError` without
 * `ifMatch`, `NotFoundError` for an unknown id, `ConflictError` for a deleted model.
 */
export async function updateModel(context: AppContext, id: string, ifMatch: string | undefined, input: ModelInput, actorId: string | null): Promise<Model> {
  const expected = expectedRevision(id, ifMatch);
  const write = revisionWrite(context, input, actorId);
  // decide inside the transaction, throw after it: a refused write commits nothing of its own
  const outcome = await inTransaction(context.dataSource, async (manager) => {
    if (expected !== null && (await repository.advanceModel(manager, id, expected, write))) {
      await recordAudit(context, { action: 'model.updated', actorId, targetType: 'model', targetId: id, detail: { revision: expected + 1, comment: input.comment } }, manager);
      return 'saved' as const;
    }
    return repository.findLoopHeader(manager, id);
  });
  if (outcome === 'saved') return getModel(context, id);
  if (outcome === null) throw new NotFoundError(`Model ${id}`);
  if (outcome.deletedAt !== null) throw new ConflictError(`Model ${id} is deleted; restore it before changing it.`);
  throw new PreconditionFailedError(`If-Match does not name the current revision: the model is at revision ${outcome.revision} (ETag ${etagOf(id, outcome.revision)}). Reload it, reapply the change and save again.`);
}

/** Soft-deletes a model (hidden from lists and reads until restored). */
export async function deleteModel(context: AppContext, id: string, actorId: string | null): Promise<void> {
  const at = now(context).toISOString();
  const changed = await inTransaction(context.dataSource, async (manager) => {
    const done = await repository.setDeleted(manager, id, at);
    if (done) await recordAudit(context, { action: 'model.deleted', actorId, targetType: 'model', targetId: id }, manager);
    return done;
  });
  if (!changed) await getModel(context, id); // throws NotFoundError for unknown or already deleted ids
}

/** Undoes a soft delete; restoring a model that is not deleted is a `ConflictError`. */
export async function restoreModel(context: AppContext, id: string, actorId: string | null): Promise<Model> {
  const changed = await inTransaction(context.dataSource, async (manager) => {
    const done = await repository.setDeleted(manager, id, null);
    if (done) await recordAudit(context, { action: 'model.restored', actorId, targetType: 'model', targetId: id }, manager);
    return done;
  });
  if (!changed) {
    await getModel(context, id, true);
    throw new ConflictError(`Model ${id} is not deleted.`);
  }
  return getModel(context, id);
}

/** The history of a model (deleted models keep theirs), newest first. */
export async function listRevisions(context: AppContext, id: string): Promise<RevisionSummary[]> {
  await getModel(context, id, true);
  return repository.listRevisions(context.dataSource, id);
}

/** One revision's full content. */
export async function getRevision(context: AppContext, id: string, revision: number): Promise<Revision> {
  const record = await repository.findRevision(context.dataSource, id, revision);
  if (!record) throw new NotFoundError(`Revision ${revision} of model ${id}`);
  return record;
}

/** The revision the If-Match header names for this model, or null when it names another resource. */
function expectedRevision(id: string, ifMatch: string | undefined): number | null {
  if (ifMatch === undefined || ifMatch.trim() === '') throw new PreconditionRequiredError();
  if (ifMatch.trim() === '*') throw new PreconditionRequiredError('If-Match: * is not accepted here; send the ETag of the revision you edited, so that a concurrent change is not overwritten.');
  for (const tag of ifMatch.split(',').map((t) => t.trim())) {
    const match = /^"(.+)-r(\d+)"$/.exec(tag);
    if (match && match[1] === id) return Number(match[2]);
  }
  return null;
}

function revisionWrite(context: AppContext, input: ModelInput, actorId: string | null): repository.RevisionWrite {
  const { comment, ...content } = input;
  return { content, comment, authorId: actorId, at: now(context).toISOString(), contentHash: contentHash(content) };
}
