import { createHash } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { TooManyRequestsError } from './problem.js';

function bearerOf(req: Request): string | null {
  const header = req.headers.authorization;
  const match = typeof header === 'string' ? /^Bearer\s+(\S+)$/i.exec(header) : null;
  return match ? (match[1] as string) : null;
}

function retryAfterSeconds(resetTime: Date | undefined): number {
  return resetTime ? Math.max(1, Math.ceil((resetTime.getTime() - Date.now()) / 1000)) : 60;
}

/**
 * Rate limits (express-rate-limit, one-minute fixed windows): each client IP address gets `perMinute`
 * requests, and each bearer token gets `perMinute` requests whichever addresses it comes from. Over the
 * limit → 429 problem+json with `Retry-After`. `perMinute` 0 turns both off (load tests).
 */
export function rateLimits(perMinute: number): RequestHandler[] {
  if (perMinute <= 0) return [];
  const common = {
    windowMs: 60_000,
    limit: perMinute,
    legacyHeaders: false,
    handler: (req: Request, _res: unknown, next: (error: unknown) => void, options: { requestPropertyName: string }) => {
      const info = (req as unknown as Record<string, { resetTime?: Date } | undefined>)[options.requestPropertyName];
      next(new TooManyRequestsError(retryAfterSeconds(info?.resetTime)));
    },
  };
  const perIp = rateLimit({ ...common, standardHeaders: 'draft-7', requestPropertyName: 'rateLimitIp' });
  const perToken = rateLimit({
    ...common,
    standardHeaders: false,
    requestPropertyName: 'rateLimitToken',
    skip: (req) => bearerOf(req) === null,
    keyGenerator: (req) => 'token:' + createHash('sha256').update(bearerOf(req) ?? '').digest('hex'),
  });
  return [perIp, perToken];
}
