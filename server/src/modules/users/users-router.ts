import express, { Router } from 'express';
import type { Database } from '../../db/client';
import { requireRole, requireSignIn } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import {
  RoleChangeBody,
  SettingsPatch,
  toSettings,
  toUserView,
  UserIdParams,
  type MeAnswer,
  type RoleChangeAnswer,
  type SettingsAnswer,
  type UsersListAnswer,
} from './users-schemas';
import { createUsersService, type UsersService } from './users-service';

/** Role changes are a few bytes; the limit only has to bound what an attacker can send. */
const BODY_LIMIT = '100kb';

export function usersRouter(users: UsersService): Router {
  const router = Router();
  router.use(['/users', '/me/settings'], express.json({ limit: BODY_LIMIT }));

  router.get('/me', requireSignIn, (req, res) => {
    const { createdAt: _createdAt, ...me } = toUserView(req.user!);
    res.json(me satisfies MeAnswer);
  });

  router.get('/me/settings', requireSignIn, async (req, res) => {
    res.json(toSettings(await users.settings(req.user!.id)) satisfies SettingsAnswer);
  });

  const changeSettings = validate({ body: SettingsPatch });
  router.patch('/me/settings', requireSignIn, changeSettings, async (req, res) => {
    const { body } = changeSettings.input(res);
    res.json(toSettings(await users.updateSettings(req.user!.id, body)) satisfies SettingsAnswer);
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

/** Users and roles: `/me`, own settings, the admin's user list and role changes (under /api/v1). */
export function createUsersModule({ db, adminLogins }: UsersModuleDeps) {
  const service = createUsersService(db, adminLogins);
  return { service, router: usersRouter(service) };
}
