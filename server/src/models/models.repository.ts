/*
 * SQL of the models feature. Every function returns plain records; parameters are always bound.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { Compensator, Model, ModelContent, ModelDesign, ModelQuery, Person, RevisionSummary } from './model.js';
import type { Plant } from '@polewright/locus-core';
import { loopHeaderCacheOf } from './loop-header-cache.js';

type Db = DataSource | EntityManager;

/** A stored model with the content of its current revision. */
export interface ModelRecord extends Model {
  readonly contentHash: string;
}

/** A revision row with its content. */
export interface RevisionRecord extends RevisionSummary, ModelContent {
  readonly modelId: string;
}

/** What the locus route needs to know before it touches any content. */
export interface LoopHeader {
  readonly revision: number;
  readonly deletedAt: string | null;
  readonly contentHash: string;
}

/** A new revision to write. */
export interface RevisionWrite {
  readonly content: ModelContent;
  readonly comment: string;
  readonly authorId: string | null;
  readonly at: string;
  readonly contentHash: string;
}

const SELECT_MODEL = `SELECT m.id, m.revision, m.created_at, m.updated_at, m.deleted_at,
    r.name, r.description, r.tags, r.plant, r.compensator, r.design, r.content_hash,
    cu.id AS c_id, cu.email AS c_email, cu.name AS c_name, uu.id AS u_id, uu.email AS u_email, uu.name AS u_name
  FROM models m
  JOIN model_revisions r ON r.model_id = m.id AND r.revision = m.revision
  LEFT JOIN users cu ON cu.id = m.created_by
  LEFT JOIN users uu ON uu.id = m.updated_by`;

const SORT_COLUMNS = { name: 'm.name COLLATE NOCASE', updatedAt: 'm.updated_at', createdAt: 'm.created_at' } as const;

/** The model with its current content, deleted or not; null when there is no such id. */
export async function findModel(db: Db, id: string): Promise<ModelRecord | null> {
  const rows = (await db.query(`${SELECT_MODEL} WHERE m.id = ?`, [id])) as Row[];
  return rows.length ? toModel(rows[0]) : null;
}

/** One page of models matching the query, and how many match in all. */
export async function listModels(db: Db, query: ModelQuery): Promise<{ items: ModelRecord[]; total: number }> {
  const where: string[] = [];
  const params: unknown[] = [];
  if (!query.includeDeleted) where.push('m.deleted_at IS NULL');
  if (query.q) {
    const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(`(m.name LIKE ? ESCAPE '\\' OR m.description LIKE ? ESCAPE '\\')`);
    params.push(like, like);
  }
  if (query.tag) {
    where.push('EXISTS (SELECT 1 FROM json_each(m.tags) t WHERE t.value = ?)');
    params.push(query.tag);
  }
  const filter = where.length ? `WHERE ${where.join(' AND ')}` : '';
  const order = `${SORT_COLUMNS[query.sort]} ${query.order === 'desc' ? 'DESC' : 'ASC'}, m.id ASC`;
  const [{ total }] = (await db.query(`SELECT COUNT(*) AS total FROM models m ${filter}`, params)) as { total: number }[];
  const rows = (await db.query(`${SELECT_MODEL} ${filter} ORDER BY ${order} LIMIT ? OFFSET ?`, [...params, query.pageSize, (query.page - 1) * query.pageSize])) as Row[];
  return { items: rows.map(toModel), total: Number(total) };
}

/** Every model that is not deleted, by name (for export). */
export async function allModels(db: Db): Promise<ModelRecord[]> {
  const rows = (await db.query(`${SELECT_MODEL} WHERE m.deleted_at IS NULL ORDER BY m.name COLLATE NOCASE, m.id`)) as Row[];
  return rows.map(toModel);
}

/** Every tag on a model that is not deleted, with how many such models carry it, sorted by tag. */
export async function listTags(db: Db): Promise<{ tag: string; count: number }[]> {
  const rows = (await db.query(
    `SELECT t.value AS tag, COUNT(DISTINCT m.id) AS count FROM models m, json_each(m.tags) t WHERE m.deleted_at IS NULL GROUP BY t.value ORDER BY t.value`,
  )) as { tag: string; count: number }[];
  return rows.map((r) => ({ tag: String(r.tag), count: Number(r.count) }));
}

/** Revision, deletion time and content hash of a model's current revision; null when there is no such id. */
export async function findLoopHeader(db: Db, id: string): Promise<LoopHeader | null> {
  const rows = (await db.query(
    `SELECT m.revision, m.deleted_at, r.content_hash FROM models m JOIN model_revisions r ON r.model_id = m.id AND r.revision = m.revision WHERE m.id = ?`,
    [id],
  )) as { revision: number; deleted_at: string | null; content_hash: string }[];
  return rows.length ? { revision: rows[0].revision, deletedAt: rows[0].deleted_at, contentHash: rows[0].content_hash } : null;
}

/** Inserts a new model with its first revision (call inside a transaction). */
export async function insertModel(manager: EntityManager, id: string, write: RevisionWrite): Promise<void> {
  const c = write.content;
  await manager.query(
    `INSERT INTO models (id, name, description, tags, revision, created_at, updated_at, created_by, updated_by, deleted_at) VALUES (?, ?, ?, ?, 1, ?, ?, ?, ?, NULL)`,
    [id, c.name, c.description, JSON.stringify(c.tags), write.at, write.at, write.authorId, write.authorId],
  );
  await insertRevision(manager, id, 1, write);
}

/**
 * Moves a model from `expectedRevision` to the next one and writes that revision, in the caller's
 * transaction. The UPDATE only matches while the stored revision is still `expectedRevision` (and the model
 * is not deleted), so of two writers holding the same ETag exactly one gets a row; returns whether it did.
 */
export async function advanceModel(manager: EntityManager, id: string, expectedRevision: number, write: RevisionWrite): Promise<boolean> {
  const c = write.content;
  const result = await affected(
    manager,
    `UPDATE models SET revision = revision + 1, name = ?, description = ?, tags = ?, updated_at = ?, updated_by = ? WHERE id = ? AND revision = ? AND deleted_at IS NULL`,
    [c.name, c.description, JSON.stringify(c.tags), write.at, write.authorId, id, expectedRevision],
  );
  if (result !== 1) return false;
  await insertRevision(manager, id, expectedRevision + 1, write);
  loopHeaderCacheOf(manager.connection).forget(id);
  return true;
}

/** Sets or clears `deleted_at`; returns whether a row changed (false when already in that state). */
export async function setDeleted(manager: EntityManager, id: string, deletedAt: string | null): Promise<boolean> {
  const sql = deletedAt === null
    ? `UPDATE models SET deleted_at = NULL WHERE id = ? AND deleted_at IS NOT NULL`
    : `UPDATE models SET deleted_at = ? WHERE id = ? AND deleted_at IS NULL`;
  const changed = (await affected(manager, sql, deletedAt === null ? [id] : [deletedAt, id])) === 1;
  if (changed) loopHeaderCacheOf(manager.connection).forget(id);
  return changed;
}

/** The history of a model, newest first. */
export async function listRevisions(db: Db, id: string): Promise<RevisionSummary[]> {
  const rows = (await db.query(
    `SELECT r.revision, r.comment, r.created_at, r.content_hash, u.id AS a_id, u.email AS a_email, u.name AS a_name
       FROM model_revisions r LEFT JOIN users u ON u.id = r.author_id WHERE r.model_id = ? ORDER BY r.revision DESC`,
    [id],
  )) as Row[];
  return rows.map(toSummary);
}

/** One revision with its content; null when it does not exist. */
export async function findRevision(db: Db, id: string, revision: number): Promise<RevisionRecord | null> {
  const rows = (await db.query(
    `SELECT r.*, u.id AS a_id, u.email AS a_email, u.name AS a_name
       FROM model_revisions r LEFT JOIN users u ON u.id = r.author_id WHERE r.model_id = ? AND r.revision = ?`,
    [id, revision],
  )) as Row[];
  if (!rows.length) return null;
  return { modelId: id, ...toSummary(rows[0]), ...toContent(rows[0]) };
}

async function insertRevision(manager: EntityManager, id: string, revision: number, write: RevisionWrite): Promise<void> {
  const c = write.content;
  await manager.query(
    `INSERT INTO model_revisions (model_id, revision, name, description, tags, plant, compensator, design, comment, author_id, created_at, content_hash) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [id, revision, c.name, c.description, JSON.stringify(c.tags), JSON.stringify(c.plant), c.compensator === null ? null : JSON.stringify(c.compensator), JSON.stringify(c.design), write.comment, write.authorId, write.at, write.contentHash],
  );
}

/** Runs an UPDATE on the transaction's connection and returns how many rows it changed. */
async function affected(manager: EntityManager, sql: string, params: unknown[]): Promise<number> {
  if (!manager.queryRunner) throw new Error('affected() needs a transaction manager');
  const result = (await manager.queryRunner.query(sql, params, true)) as { affected?: number };
  return result.affected ?? 0;
}

type Row = Record<string, unknown>;

function person(row: Row, prefix: string): Person | null {
  return row[`${prefix}_id`] == null ? null : { id: String(row[`${prefix}_id`]), email: String(row[`${prefix}_email`]), name: String(row[`${prefix}_name`]) };
}

function toContent(row: Row): ModelContent {
  return {
    name: String(row['name']),
    description: String(row['description']),
    tags: JSON.parse(String(row['tags'])) as string[],
    plant: JSON.parse(String(row['plant'])) as Plant,
    compensator: row['compensator'] == null ? null : (JSON.parse(String(row['compensator'])) as Compensator),
    design: JSON.parse(String(row['design'])) as ModelDesign,
  };
}

function toModel(row: Row): ModelRecord {
  return {
    id: String(row['id']),
    ...toContent(row),
    revision: Number(row['revision']),
    createdAt: String(row['created_at']),
    updatedAt: String(row['updated_at']),
    createdBy: person(row, 'c'),
    updatedBy: person(row, 'u'),
    deletedAt: row['deleted_at'] == null ? null : String(row['deleted_at']),
    contentHash: String(row['content_hash']),
  };
}

function toSummary(row: Row): RevisionSummary {
  return { revision: Number(row['revision']), comment: String(row['comment']), createdAt: String(row['created_at']), author: person(row, 'a'), contentHash: String(row['content_hash']) };
}
