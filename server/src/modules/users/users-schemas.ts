import { z } from 'zod';
import { ROLES, type UserRow } from '../../../../schema';
import { IdParams } from '../../middleware/validate';

/**
 * The contract of the users routes: requests (validated at the edge) and answers (checked in
 * tests/api/users.test.ts). The client imports the inferred types with `import type` only.
 */
export const Role = z.enum(ROLES);

// ---- PATCH /api/v1/users/:id ----

/** `:id` of a user: the integer identity column's range, so 2^31 and beyond are a 400. */
export const UserIdParams = IdParams;
export const RoleChangeBody = z.object({ role: Role }).strict();

// ---- GET, PATCH /api/v1/me/settings ----

/** What a user may change about their own account. */
export const SettingsPatch = z.object({ emailNotifications: z.boolean() }).strict();
/** The user's settings, and the address notifications go to (from GitHub; read-only here). */
export const SettingsAnswer = z.object({
  emailNotifications: z.boolean(),
  email: z.string().nullable(),
});
export type SettingsPatch = z.infer<typeof SettingsPatch>;
export type SettingsAnswer = z.infer<typeof SettingsAnswer>;

export const toSettings = (u: UserRow): SettingsAnswer => ({
  emailNotifications: u.emailNotifications,
  email: u.email,
});

// ---- answers ----

export const UserView = z.object({
  id: z.number().int(),
  login: z.string(),
  name: z.string(),
  role: Role,
  avatarUrl: z.string().nullable(),
  /** ISO 8601. */
  createdAt: z.string(),
});

/** `GET /api/v1/me`. */
export const MeAnswer = UserView.omit({ createdAt: true });
/** `GET /api/v1/users`. */
export const UsersListAnswer = z.object({ users: z.array(UserView) });
/** `PATCH /api/v1/users/:id`. */
export const RoleChangeAnswer = z.object({ user: UserView });

export type UserView = z.infer<typeof UserView>;
export type MeAnswer = z.infer<typeof MeAnswer>;
export type UsersListAnswer = z.infer<typeof UsersListAnswer>;
export type RoleChangeAnswer = z.infer<typeof RoleChangeAnswer>;
export type RoleChangeInput = z.infer<typeof RoleChangeBody>;

/** The public shape of a user; the one mapping every route uses. */
export function toUserView(u: UserRow): UserView {
  return {
    id: u.id,
    login: u.login,
    name: u.name,
    role: u.role,
    avatarUrl: u.avatarUrl,
    createdAt: u.createdAt.toISOString(),
  };
}
