import type { RequestHandler } from 'express';
import { ROLES, type Role } from '../../../schema';
import { forbidden, unauthenticated } from '../lib/app-error';

const rank = (role: Role) => ROLES.indexOf(role);

/** The one role guard: the signed-in user must hold `minimum` or a higher role. */
export function requireRole(minimum: Role): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthenticated();
    if (rank(req.user.role) < rank(minimum)) {
      throw forbidden(`This needs the ${minimum} role; you are signed in as ${req.user.role}`);
    }
    next();
  };
}

export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthenticated();
  next();
};
