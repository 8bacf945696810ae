import { ROLES, type Role } from '../../../../schema';

/** Roles are ordered reader < curator < editor < admin; a higher role includes the lower ones. */
export const hasRole = (role: Role, minimum: Role): boolean =>
  ROLES.indexOf(role) >= ROLES.indexOf(minimum);
