import { z } from 'zod';
import { ROLES, type UserRow } from '../../../../schema';
import { IdParams } from '../../middleware/validate';

/** `:id` of a user: the integer identity column's range, so 2^31 and beyond are a 400. */
export const UserIdParams = IdParams;
export const RoleChangeBody = z.object({ role: z.enum(ROLES) }).strict();

/** The public shape of a user; the one mapping every route uses. */
export function toUserView(u: UserRow) {
  return {
    id: u.id,
    login: u.login,
    name: u.name,
    role: u.role,
    avatarUrl: u.avatarUrl,
    createdAt: u.createdAt.toISOString(),
  };
}

export type UserView = ReturnType<typeof toUserView>;
export type MeView = Omit<UserView, 'createdAt'>;
export type UsersListView = { users: UserView[] };
export type RoleChangeInput = z.infer<typeof RoleChangeBody>;
