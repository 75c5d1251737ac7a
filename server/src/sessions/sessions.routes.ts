import { Router } from 'express';
import type { AppContext } from '../context.js';
import { NotFoundError } from '../http/problem.js';
import type { components } from '../openapi/api-types.js';
import { ROLE_PERMISSIONS } from '../auth/permissions.js';
import { requireSession } from '../auth/authorize.js';
import type { Principal } from '../auth/principal.js';
import { userView } from '../users/user-view.js';
import { findUserById } from '../users/users.repository.js';
import { updateSelf } from '../users/users.service.js';
import { findSessionById } from './sessions.repository.js';
import { signIn, signOut } from './sessions.service.js';

type SignIn = components['schemas']['SignIn'];
type SessionCreated = components['schemas']['SessionCreated'];
type Me = components['schemas']['Me'];
type MeUpdate = components['schemas']['MeUpdate'];

/** The signed-in caller: their user, permissions and the session of this request. */
async function meOf(context: AppContext, principal: Principal): Promise<Me> {
  const [user, session] = await Promise.all([findUserById(context, principal.userId ?? ''), findSessionById(context, principal.tokenId)]);
  if (!user || !session) throw new NotFoundError('The session');
  return { user: userView(user), permissions: [...ROLE_PERMISSIONS[user.role]], session: { id: session.id, expiresAt: session.expiresAt } };
}

/** `POST /sessions` (sign in), `DELETE /sessions/current` (sign out), `GET /me` and `PATCH /me` (own name, password). */
export function sessionsRouter(context: AppContext): Router {
  const router = Router();
  router.post('/sessions', async (req, res) => {
    const body = req.body as SignIn;
    const session = await signIn(context, body.email, body.password, req.ip);
    const created: SessionCreated = { token: session.token, expiresAt: session.expiresAt, user: userView(session.user) };
    res.status(201).json(created);
  });
  router.delete('/sessions/current', async (req, res) => {
    const principal = requireSession(req.principal);
    await signOut(context, principal.tokenId, principal.userId);
    res.status(204).end();
  });
  router.get('/me', async (req, res) => {
    res.json(await meOf(context, requireSession(req.principal)));
  });
  router.patch('/me', async (req, res) => {
    const principal = requireSession(req.principal);
    await updateSelf(context, principal, req.body as MeUpdate);
    res.json(await meOf(context, principal));
  });
  return router;
}
