import type { Request, RequestHandler } from 'express';
import passport from 'passport';
import { Strategy as BearerStrategy } from 'passport-http-bearer';
import type { AppContext } from '../context.js';
import { UnauthorizedError } from '../http/problem.js';
import type { Principal } from './principal.js';
import { requestOrigin } from './request-origin.js';
import { resolveToken } from './resolve-token.js';

/**
 * The one bearer strategy (passport-http-bearer) for sessions, API keys and embed tokens. The middleware
 * sets `req.principal` when a token is present and valid, fails with 401/403 when a token is present but
 * not acceptable, and lets requests without any token through: each operation's `x-polewright-permission`
 * in the OpenAPI document (applied by `authorizeOperation`, next) decides what needs a token.
 */
export function authenticate(context: AppContext): RequestHandler {
  const authenticator = new passport.Passport();
  authenticator.use(
    'bearer',
    new BearerStrategy({ passReqToCallback: true }, (req: Request, token: string, done: (error: unknown, principal?: Principal) => void) => {
      resolveToken(context, token, requestOrigin(req)).then(
        (principal) => done(null, principal),
        (error: unknown) => done(error),
      );
    }),
  );
  const middleware = authenticator.initialize();
  return (req, res, next) => {
    const header = req.headers.authorization;
    if (header === undefined) return next();
    middleware(req, res, () => {
      authenticator.authenticate('bearer', { session: false }, (error: unknown, principal: Principal | false) => {
        if (error) return next(error);
        if (!principal) return next(new UnauthorizedError('The Authorization header must be "Bearer <token>".'));
        req.principal = principal;
        next();
      })(req, res, next);
    });
  };
}
