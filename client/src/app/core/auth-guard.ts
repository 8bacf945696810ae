import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';

import type { Role } from './models/user';
import { Session } from './session';

/**
 * Lets a route match only for signed-in users holding one of `roles`; everyone else is sent
 * to the "Not allowed" page, which names the roles needed.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return async () => {
    const session = inject(Session);
    const router = inject(Router);
    const user = await session.whenKnown();
    if (user && roles.includes(user.role)) return true;
    return router.createUrlTree(['/not-allowed'], { queryParams: { needs: roles.join(',') } });
  };
}
