import express, { Router } from 'express';
import type { Database } from '../../db/client';
import { requireRole, requireSignIn } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import {
  RoleChangeBody,
  toUserView,
  UserIdParams,
  type MeAnswer,
  type RoleChangeAnswer,
  type UsersListAnswer,
} from './users-schemas';
import { createUsersService, type UsersService } from './users-service';

/** Role changes are a few bytes; the limit only has to bound what an attacker can send. */
const BODY_LIMIT = '100kb';

export function usersRouter(users: UsersService): Router {
  const router = Router();
  router.use('/users', express.json({ limit: BODY_LIMIT }));

  router.get('/me', requireSignIn, (req, res) => {
    const { createdAt: _createdAt, ...me } = toUserView(req.user!);
    res.json(me satisfies MeAnswer);
  });

  router.get('/users', requireRole('admin'), async (_req, res) => {
    res.json({ users: (await users.list()).map(toUserView) } satisfies UsersListAnswer);
  });

  const changeRole = validate({ params: UserIdParams, body: RoleChangeBody });
  router.patch(
    '/users/:id',
    requireSignIn,
    changeRole,
    requireRole('admin', {
      onRefused: (_req, res, actor) =>
        users.recordRefusal(
          actor.id,
          'user.role_change_refused',
          'user',
          changeRole.input(res).params.id,
        ),
    }),
    async (req, res) => {
      const { params, body } = changeRole.input(res);
      const user = toUserView(await users.changeRole(req.user!, params.id, body.role));
      res.json({ user } satisfies RoleChangeAnswer);
    },
  );
  return router;
}

export interface UsersModuleDeps {
  db: Database;
  /** GitHub logins that become admin at their first sign-in. */
  adminLogins: readonly string[];
}

/** Users and roles: `/me`, the admin's user list and role changes (mounted under /api/v1). */
export function createUsersModule({ db, adminLogins }: UsersModuleDeps) {
  const service = createUsersService(db, adminLogins);
  return { service, router: usersRouter(service) };
}
