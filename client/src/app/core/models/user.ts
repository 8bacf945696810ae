/** Roles as the server assigns them (`GET /api/v1/me`, `GET /api/v1/users`). */
export type Role = 'reader' | 'curator' | 'editor' | 'admin';

export const ROLES: readonly Role[] = ['reader', 'curator', 'editor', 'admin'];

/** Body of `GET /api/v1/me`. */
export interface SignedInUser {
  id: number;
  login: string;
  name: string;
  role: Role;
  avatarUrl: string | null;
}
