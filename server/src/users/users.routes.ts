import { Router } from 'express';
import type { AppContext } from '../context.js';
import { pagingOf } from '../http/paging.js';
import { NotFoundError } from '../http/problem.js';
import type { components } from '../openapi/api-types.js';
import { userView } from './user-view.js';
import { findUserById, listUsers } from './users.repository.js';
import { readUserQuery } from './user-query.js';
import { acceptInvitation, changeUser, getInvitation, inviteUser } from './users.service.js';

type S = components['schemas'];

/** Admin user management (`/users`) and the public `GET /invitations/{token}` and `POST /invitations/{token}/accept`. */
export function usersRouter(context: AppContext): Router {
  const router = Router();
  router.get('/users', async (req, res) => {
    const { page, pageSize } = pagingOf(req);
    const { items, total } = await listUsers(context, readUserQuery(req.query as Record<string, unknown>), page, pageSize);
    const body: S['UserPage'] = { items: items.map(userView), total, page, pageSize };
    res.json(body);
  });
  router.post('/users', async (req, res) => {
    const input = req.body as S['UserInvite'];
    const { user, invitationExpiresAt } = await inviteUser(context, req.principal!, input);
    const body: S['UserInvited'] = { user: userView(user), invitationExpiresAt };
    res.status(201).location(`/api/v1/users/${user.id}`).json(body);
  });
  router.get('/users/:id', async (req, res) => {
    const user = await findUserById(context, req.params['id'] as string);
    if (!user) throw new NotFoundError('The user');
    res.json(userView(user) satisfies S['User']);
  });
  router.patch('/users/:id', async (req, res) => {
    const user = await changeUser(context, req.principal!, req.params['id'] as string, req.body as S['UserUpdate']);
    res.json(userView(user) satisfies S['User']);
  });
  router.get('/invitations/:token', async (req, res) => {
    const { state, invitation, user } = await getInvitation(context, req.params['token'] as string);
    const body: S['Invitation'] = { state, email: user.email, name: user.name, role: user.role, expiresAt: invitation.expiresAt };
    // the state changes when the invitation is used or expires: never reuse this answer from a cache
    res.set('Cache-Control', 'no-store').json(body);
  });
  router.post('/invitations/:token/accept', async (req, res) => {
    const input = req.body as S['InvitationAccept'];
    const session = await acceptInvitation(context, req.params['token'] as string, input.name, input.password);
    const body: S['SessionCreated'] = { token: session.token, expiresAt: session.expiresAt, user: userView(session.user) };
    res.status(201).json(body);
  });
  return router;
}
