import type { Request, RequestHandler, Response } from 'express';
import type { Role } from '../../../schema';
import { AppError, forbidden, unauthenticated } from '../lib/app-error';
import { hasRole } from '../modules/users/roles';
import { viaBearerToken } from './bearer-auth';

export interface RoleGuardOptions {
  /** Called before a signed-in caller is refused, e.g. to audit a refused privileged attempt. */
  onRefused?: (req: Request, res: Response, actor: Express.User) => Promise<void>;
}

/**
 * The one role guard: the signed-in user must hold `minimum` or a higher role. An API token
 * stands for its user up to curator work (reading, proposing, sources, uploads), so curators'
 * scripts can propose; reviewing, publishing and administration (editor and above) need a
 * browser session, where a person is present.
 */
export function requireRole(minimum: Role, options: RoleGuardOptions = {}): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw unauthenticated();
    if (hasRole(minimum, 'editor') && viaBearerToken(res)) {
      throw new AppError(
        403,
        'session_required',
        `This needs the ${minimum} role in a signed-in browser session; API tokens read and propose only`,
      );
    }
    if (!hasRole(req.user.role, minimum)) {
      await options.onRefused?.(req, res, req.user);
      throw forbidden(`This needs the ${minimum} role; you are signed in as ${req.user.role}`);
    }
    next();
  };
}

export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthenticated();
  next();
};
