import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import type { Principal } from '../auth/principal.js';
import { hashToken, newToken } from '../auth/tokens.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { InputError, type InputIssue, NotFoundError } from '../http/problem.js';
import { insertEmbedToken, missingModelIds } from './embed-tokens.repository.js';

/** Whether `origin` is a bare web origin (`https://host[:port]`, no path, query or trailing slash). */
export function isOrigin(origin: string): boolean {
  try {
    const url = new URL(origin);
    return (url.protocol === 'http:' || url.protocol === 'https:') && url.origin === origin;
  } catch {
    return false;
  }
}

/** Issues a read-only embed token bound to existing models and to page origins, for `ttlSeconds`. */
export async function issueEmbedToken(context: AppContext, actor: Principal, input: { modelIds: string[]; origins: string[]; ttlSeconds: number }) {
  const issues: InputIssue[] = input.origins.flatMap((o, i) => (isOrigin(o) ? [] : [{ pointer: `/origins/${i}`, detail: 'must be an origin like https://intranet.example:8443 (scheme, host, optional port; no path or trailing slash)' }]));
  if (issues.length > 0) throw new InputError(issues);
  const missing = await missingModelIds(context, input.modelIds);
  if (missing.length > 0) throw new NotFoundError(`The model ${missing.join(', ')}`);
  const at = now(context);
  const token = newToken('embed');
  const expiresAt = new Date(at.getTime() + input.ttlSeconds * 1000).toISOString();
  const id = randomUUID();
  await inTransaction(context.dataSource, async (manager) => {
    await insertEmbedToken(context, { id, tokenHash: hashToken(token), modelIds: [...input.modelIds], origins: [...input.origins], createdBy: actor.userId ?? '', createdAt: at.toISOString(), expiresAt }, manager);
    await recordAudit(context, { action: 'embed-token.created', actorId: actor.userId, targetType: 'embed-token', targetId: id, detail: { modelIds: input.modelIds, origins: input.origins, expiresAt } }, manager);
  });
  return { token, expiresAt, modelIds: [...input.modelIds], origins: [...input.origins] };
}
