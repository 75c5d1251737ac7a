import { Router, type Request, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import { type AppContext, now } from '../context.js';
import { InputError, UnsupportedMediaTypeError, type InputIssue } from '../http/errors.js';
import type { components } from '../openapi/api-types.js';
import { etagOf, writable, type Model } from './model.js';
import { toBundle } from './model-bundle.js';
import { importModels } from './model-import.js';
import { readModelInput } from './model-input.js';
import { modelLocus } from './model-locus.js';
import { readFlag, readModelQuery } from './model-query.js';
import * as models from './models.service.js';
import * as repository from './models.repository.js';

/** Largest import file accepted (bytes). */
export const MAX_IMPORT_BYTES = 1024 * 1024;

/** Memory storage with a size limit: an oversized file is a MulterError LIMIT_FILE_SIZE (problem.ts: 413). */
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 10 } });

const acceptMultipart: RequestHandler = (req, _res, next) => {
  if (!req.is('multipart/form-data')) return next(new UnsupportedMediaTypeError('Upload the file as multipart/form-data in the field "file".'));
  next();
};

type S = components['schemas'];

function sendModel(res: Response, model: Model, status = 200): void {
  const body: S['Model'] = writable(model);
  res.status(status).setHeader('ETag', etagOf(model.id, model.revision, model.deletedAt !== null)).json(body);
}

function actorOf(req: Request): string | null {
  return req.principal?.userId ?? null;
}

function flag(req: Request, name: string): boolean {
  const issues: InputIssue[] = [];
  const value = readFlag(req.query[name], `/query/${name}`, issues);
  if (issues.length) throw new InputError(issues);
  return value;
}

/**
 * The models routes (mounted under `/api/v1`): list, create, read, update with If-Match, soft delete,
 * restore, history, cached locus, import, export and the tags in use.
 */
export function modelsRouter(context: AppContext): Router {
  const router = Router();

  router.get('/models', async (req, res) => {
    const body: S['ModelPage'] = writable(await models.listModels(context, readModelQuery(req.query as Record<string, unknown>)));
    res.json(body);
  });
  router.post('/models', async (req, res) => {
    const model = await models.createModel(context, readModelInput(req.body), actorOf(req));
    res.setHeader('Location', `${req.baseUrl}/models/${model.id}`);
    sendModel(res, model, 201);
  });

  router.post('/models/import', acceptMultipart, upload.single('file'), async (req, res) => {
    if (!req.file) throw InputError.at('/file', 'is required: upload the bundle or CSV in the multipart field "file"');
    const body: S['ImportResult'] = writable(await importModels(context, req.file, actorOf(req)));
    res.json(body);
  });
  router.get('/models/export', async (req, res) => {
    const tag = typeof req.query['tag'] === 'string' && req.query['tag'] !== '' ? req.query['tag'].toLowerCase() : null;
    const all = (await repository.allModels(context.dataSource)).map(models.toResource).filter((m) => tag === null || m.tags.includes(tag));
    const at = now(context);
    res.setHeader('Content-Disposition', `attachment; filename="polewright-models-${at.toISOString().slice(0, 10)}.json"`);
    const body: S['ModelBundle'] = writable(toBundle(all, at));
    res.json(body);
  });
  // literal paths before `/models/:id`, as the document's operation table orders them (api-operations.ts)
  router.get('/models/tags', async (_req, res) => {
    const body: S['ModelTags'] = { items: await models.listTags(context) };
    res.json(body);
  });

  router.get('/models/:id', async (req, res) => {
    sendModel(res, await models.getModel(context, String(req.params['id']), flag(req, 'includeDeleted')));
  });
  router.put('/models/:id', async (req, res) => {
    const id = String(req.params['id']);
    const input = readModelInput(req.body);
    sendModel(res, await models.updateModel(context, id, req.headers['if-match'], input, actorOf(req)));
  });
  router.delete('/models/:id', async (req, res) => {
    await models.deleteModel(context, String(req.params['id']), actorOf(req));
    res.status(204).end();
  });
  router.post('/models/:id/restore', async (req, res) => {
    sendModel(res, await models.restoreModel(context, String(req.params['id']), actorOf(req)));
  });
  router.get('/models/:id/revisions', async (req, res) => {
    const items: S['RevisionSummary'][] = await models.listRevisions(context, String(req.params['id']));
    res.json({ items });
  });
  router.get('/models/:id/revisions/:revision', async (req, res) => {
    const revision = Number(req.params['revision']);
    if (!Number.isInteger(revision) || revision < 1) throw InputError.at('/path/revision', 'must be a whole number from 1');
    const body: S['Revision'] = writable(await models.getRevision(context, String(req.params['id']), revision));
    res.json(body);
  });
  router.get('/models/:id/locus', async (req, res) => {
    const served = await modelLocus(context, String(req.params['id']));
    res.setHeader('ETag', served.etag);
    res.setHeader('X-Locus-Cache', served.cached ? 'hit' : 'miss');
    res.type('application/json');
    // the caller already holds this exact result: 304 without a body (req.fresh compares If-None-Match)
    if (req.fresh) return void res.status(304).end();
    res.send(served.body);
  });
  return router;
}
