import { recordAudit } from '../audit/audit.service.js';
import { type AppContext, logLine, now } from '../context.js';
import { findUserById } from '../users/users.repository.js';
import { findKeysNeedingNotice, updateApiKey } from './api-keys.repository.js';

/**
 * Mails the admin who issued each live API key that expires within `keyExpiryNoticeDays` (once per key).
 * Returns how many notices went out. Uses the context's clock, so tests move time instead of waiting.
 */
export async function sendKeyExpiryNotices(context: AppContext): Promise<number> {
  const at = now(context);
  const horizon = new Date(at.getTime() + context.config.keyExpiryNoticeDays * 86_400_000).toISOString();
  const keys = (await findKeysNeedingNotice(context, horizon)).filter((k) => k.expiresAt !== null && k.expiresAt > at.toISOString());
  let sent = 0;
  for (const key of keys) {
    const issuer = await findUserById(context, key.createdBy);
    if (!issuer || issuer.status !== 'active') continue;
    await context.mailer.send({
      to: issuer.email,
      subject: `Polewright API key "${key.name}" expires on ${key.expiresAt}`,
      text: [
        `Hello ${issuer.name},`,
        '',
        `the API key "${key.name}" (${key.prefix}…, scopes ${key.scopes.join(', ')}) that you issued expires at ${key.expiresAt}.`,
        'Scripts using it will then get 401. Issue a new key and switch them over before that time:',
        `${context.config.publicUrl}/api/docs`,
      ].join('\n'),
    });
    await updateApiKey(context, key.id, { expiryNoticeSentAt: at.toISOString() });
    await recordAudit(context, { action: 'api-key.expiry-notice', actorId: null, targetType: 'api-key', targetId: key.id, detail: { to: issuer.email } });
    sent++;
  }
  return sent;
}

/** Runs `sendKeyExpiryNotices` every `keyExpiryCheckMs` (and once at start); returns a stop function. */
export function startKeyExpiryNotices(context: AppContext): () => void {
  const every = context.config.keyExpiryCheckMs;
  if (every <= 0) return () => undefined;
  const run = () => void sendKeyExpiryNotices(context).catch((error: unknown) => logLine(context, `key-expiry notices failed: ${String(error)}`));
  run();
  const timer = setInterval(run, every);
  timer.unref();
  return () => clearInterval(timer);
}
