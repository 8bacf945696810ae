import type { Role } from '../../../core/models/user';

/** One user as `GET /api/v1/users` lists it. `createdAt` is an ISO 8601 timestamp. */
export interface UserRecord {
  id: number;
  login: string;
  name: string;
  role: Role;
  createdAt: string;
}

/** Body of `GET /api/v1/users`. */
export interface UserList {
  users: UserRecord[];
}

/** Body of `PATCH /api/v1/users/:id`. */
export interface RoleChange {
  role: Role;
}

/** Answer of `PATCH /api/v1/users/:id`. */
export interface UpdatedUser {
  user: UserRecord;
}
