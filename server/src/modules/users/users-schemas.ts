import { z } from 'zod';
import { ROLES, type UserRow } from '../../../../schema';

export const UserIdParams = z.object({ id: z.coerce.number().int().positive() });
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
