/*
 * The "host backend" of the embedding demo page (demo/embed, served at /embed-demo/). A real host page's
 * backend mints the embed token with its own credentials; this demo page is served by the Polewright
 * server itself, so the server plays that backend for it: an embed token for the two demo loops of line 3,
 * issued as the seeded demo engineer through the ordinary embed-token service. Not part of the API.
 */
import type { Principal } from '../auth/principal.js';
import { type AppContext, now } from '../context.js';
import { issueEmbedToken } from '../embed-tokens/embed-tokens.service.js';
import { NotFoundError } from '../http/problem.js';
import { listModels } from '../models/models.repository.js';
import { scenarioLoops } from '../models/models.seed.js';
import { DEMO_PEOPLE } from '../seed/demo-people.js';
import { findUserByEmail } from '../users/users.repository.js';

/** The scenario loops the demo page shows (demo/scenario.json keys): one speed gain, light and full load. */
export const DEMO_LOOP_KEYS = ['line3-belt-speed', 'line3-belt-speed-full-load'] as const;

/** Lifetime of a demo embed token. */
export const DEMO_TOKEN_TTL_SECONDS = 3600;

/** A minted token is handed out again while it has at least this long to live (page reloads mint nothing). */
const REUSE_MIN_REMAINING_MS = 30 * 60_000;

/** Minted tokens kept for reuse, per context; at most this many origin/model combinations. */
const REUSE_MAX_ENTRIES = 16;

/** What the demo page receives. */
export interface DemoSession {
  readonly token: string;
  readonly expiresAt: string;
  readonly apiBase: '/api';
  readonly loops: readonly { readonly id: string; readonly name: string; readonly key: string }[];
}

/** The embedding demo cannot run on this server (demo off, demo loops missing or deleted): a 404. */
export class EmbedDemoUnavailableError extends NotFoundError {
  constructor(reason: string) {
    super('The embedding demo');
    // problem.ts shows a NotFoundError's message as the detail: say what is missing and how to get it
    this.message = `${reason} The embedding demo needs the seeded demo of Quillfield Conveyor Works: start the server with POLEWRIGHT_DEMO not set to off, on a new database (the demo is seeded into an empty one).`;
  }
}

const reuse = new WeakMap<AppContext, Map<string, { token: string; expiresAt: string }>>();

/**
 * Mints (or hands out again) an embed token for the demo page, bound to the two demo loops and to
 * `origins` (the page's own origins), issued as the seeded demo engineer for DEMO_TOKEN_TTL_SECONDS.
 * Throws EmbedDemoUnavailableError when the demo is off or its loops or engineer are missing.
 */
export async function openDemoSession(context: AppContext, origins: readonly string[]): Promise<DemoSession> {
  if (!context.config.demo) throw new EmbedDemoUnavailableError('The demo is turned off on this server (POLEWRIGHT_DEMO=off).');
  const loops = await demoLoops(context);
  const engineer = await demoEngineer(context);
  const modelIds = loops.map((l) => l.id);
  const key = `${modelIds.join(',')} ${[...origins].sort().join(' ')}`;
  const minted = reuseOf(context);
  const at = now(context).getTime();
  const kept = minted.get(key);
  if (kept && Date.parse(kept.expiresAt) - at >= REUSE_MIN_REMAINING_MS) return { ...kept, apiBase: '/api', loops };
  const issued = await issueEmbedToken(context, engineer, { modelIds, origins: [...origins], ttlSeconds: DEMO_TOKEN_TTL_SECONDS });
  minted.delete(key);
  minted.set(key, { token: issued.token, expiresAt: issued.expiresAt });
  if (minted.size > REUSE_MAX_ENTRIES) minted.delete(minted.keys().next().value as string);
  return { token: issued.token, expiresAt: issued.expiresAt, apiBase: '/api', loops };
}

/** The demo loops as saved models, found by their scenario name (not deleted; the oldest of equal names). */
async function demoLoops(context: AppContext): Promise<DemoSession['loops']> {
  const scenario = scenarioLoops();
  const loops: { id: string; name: string; key: string }[] = [];
  for (const key of DEMO_LOOP_KEYS) {
    const name = scenario.find((l) => l.key === key)?.name;
    if (!name) throw new EmbedDemoUnavailableError(`demo/scenario.json has no loop "${key}".`);
    const found = await listModels(context.dataSource, { q: name, sort: 'createdAt', order: 'asc', page: 1, pageSize: 200, includeDeleted: false });
    const model = found.items.find((m) => m.name === name);
    if (!model) throw new EmbedDemoUnavailableError(`The demo model "${name}" is not on this server (never seeded, renamed or deleted).`);
    loops.push({ id: model.id, name: model.name, key });
  }
  return loops;
}

/** The seeded demo engineer as the issuer of the token (active), or EmbedDemoUnavailableError. */
async function demoEngineer(context: AppContext): Promise<Principal> {
  const email = DEMO_PEOPLE.find((p) => p.role === 'engineer')?.email ?? '';
  const user = await findUserByEmail(context, email);
  if (!user || user.status !== 'active') throw new EmbedDemoUnavailableError(`The demo engineer ${email} is not an active user here.`);
  return { kind: 'session', userId: user.id, role: user.role, scopes: new Set(['models:read']), modelIds: null, origins: null, tokenId: 'embed-demo' };
}

function reuseOf(context: AppContext): Map<string, { token: string; expiresAt: string }> {
  let map = reuse.get(context);
  if (!map) reuse.set(context, (map = new Map()));
  return map;
}
