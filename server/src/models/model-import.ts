/*
 * Import of models from an uploaded file: a JSON bundle (as exported) or a CSV. Every row is checked like
 * a create; the valid rows are written together in ONE transaction and the rejected rows are skipped with
 * their reasons (partial import, never half-written: a failing write rolls every row of the file back).
 */
import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { InputError, type InputIssue } from '../http/errors.js';
import { contentHash } from './content-hash.js';
import { BUNDLE_FORMAT, BUNDLE_VERSION } from './model-bundle.js';
import { readModelCsv } from './model-csv.js';
import { readModelInput } from './model-input.js';
import type { ModelInput } from './model.js';
import { insertModel } from './models.repository.js';

/** Most rows one file may hold. */
export const MAX_IMPORT_ROWS = 1000;

/** The uploaded file as multer hands it over (memory storage). */
export interface UploadedFile {
  readonly buffer: Buffer;
  readonly originalname: string;
  readonly mimetype: string;
}

/** Outcome of one row. */
export interface ImportRowResult {
  readonly row: number;
  readonly status: 'created' | 'rejected';
  readonly id?: string;
  readonly name?: string;
  readonly errors?: InputIssue[];
}

/** Outcome of an import. */
export interface ImportResult {
  readonly format: 'json' | 'csv';
  readonly created: number;
  readonly rejected: number;
  readonly results: ImportRowResult[];
}

/** Imports the models of `file`; throws `InputError` (pointer `/file`) when the file cannot be read at all. */
export async function importModels(context: AppContext, file: UploadedFile, actorId: string | null): Promise<ImportResult> {
  const format = formatOf(file);
  const text = file.buffer.toString('utf8');
  const rows = format === 'json' ? readBundle(text) : readModelCsv(text);
  if (rows.length > MAX_IMPORT_ROWS) throw InputError.at('/file', `holds ${rows.length} models; at most ${MAX_IMPORT_ROWS} per file`);

  const checked = rows.map(({ row, body }) => {
    try {
      return { row, input: readModelInput(body) };
    } catch (error) {
      if (error instanceof InputError) return { row, errors: [...error.issues], name: nameOf(body) };
      throw error;
    }
  });
  const accepted = checked.filter((c): c is { row: number; input: ModelInput } => 'input' in c).map((c) => ({ ...c, id: randomUUID() }));
  const at = now(context).toISOString();
  if (accepted.length > 0) {
    await inTransaction(context.dataSource, async (manager) => {
      for (const { input, id } of accepted) {
        const { comment, ...content } = input;
        await insertModel(manager, id, { content, comment: comment || `Imported from ${file.originalname}`, authorId: actorId, at, contentHash: contentHash(content) });
      }
      await recordAudit(context, { action: 'model.imported', actorId, targetType: 'model', detail: { file: file.originalname, format, created: accepted.length, rejected: checked.length - accepted.length, ids: accepted.map((a) => a.id) } }, manager);
    });
  }
  const ids = new Map(accepted.map((a) => [a.row, a]));
  const results: ImportRowResult[] = checked.map((c) => {
    const done = ids.get(c.row);
    return done ? { row: c.row, status: 'created', id: done.id, name: done.input.name } : { row: c.row, status: 'rejected', name: 'name' in c ? c.name : undefined, errors: 'errors' in c ? c.errors : [] };
  });
  return { format, created: accepted.length, rejected: results.length - accepted.length, results };
}

function formatOf(file: UploadedFile): 'json' | 'csv' {
  const name = file.originalname.toLowerCase();
  if (name.endsWith('.json') || file.mimetype === 'application/json') return 'json';
  if (name.endsWith('.csv') || file.mimetype === 'text/csv') return 'csv';
  // no telling name or type: a JSON bundle starts with "{"
  return file.buffer.toString('utf8', 0, Math.min(file.buffer.length, 64)).trimStart().startsWith('{') ? 'json' : 'csv';
}

function nameOf(body: unknown): string | undefined {
  const name = typeof body === 'object' && body !== null ? (body as Record<string, unknown>)['name'] : undefined;
  return typeof name === 'string' ? name : undefined;
}

function readBundle(text: string): { row: number; body: unknown }[] {
  let bundle: unknown;
  try {
    bundle = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch {
    throw InputError.at('/file', 'is not valid JSON');
  }
  const record = bundle as Record<string, unknown> | null;
  if (typeof record !== 'object' || record === null || Array.isArray(record) || record['format'] !== BUNDLE_FORMAT) {
    throw InputError.at('/file', `is not a model bundle: expected { "format": "${BUNDLE_FORMAT}", "version": ${BUNDLE_VERSION}, "models": [...] }`);
  }
  if (record['version'] !== BUNDLE_VERSION) throw InputError.at('/file', `has bundle version ${String(record['version'])}; this server reads version ${BUNDLE_VERSION}`);
  if (!Array.isArray(record['models'])) throw InputError.at('/file', 'has no "models" array');
  return (record['models'] as unknown[]).map((entry, i) => ({ row: i + 1, body: entry }));
}
