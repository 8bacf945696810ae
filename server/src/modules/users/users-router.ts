import { Router } from 'express';
import { requireRole, requireSignIn } from '../../middleware/require-role';
import { parseWith } from '../../middleware/validate';
import { RoleChangeBody, toUserView, UserIdParams } from './users-schemas';
import type { UsersService } from './users-service';

export function usersRouter(users: UsersService): Router {
  const router = Router();

  router.get('/me', requireSignIn, (req, res) => {
    const { createdAt: _createdAt, ...me } = toUserView(req.user!);
    res.json(me);
  });

  router.get('/users', requireRole('admin'), async (_req, res) => {
    res.json({ users: (await users.list()).map(toUserView) });
  });

  router.patch('/users/:id', requireRole('admin'), async (req, res) => {
    const { id } = parseWith(UserIdParams, req.params);
    const { role } = parseWith(RoleChangeBody, req.body);
    res.json({ user: toUserView(await users.changeRole(req.user!, id, role)) });
  });

  return router;
}
