import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';

import type { Role } from './models/user';
import { Session } from './session';

/**
 * Lets a route match only for signed-in users holding one of `roles`; everyone else is sent
 * to the "Not allowed" page, which names the roles needed. When the session could not be read
 * (server busy: 429, or down) nobody is refused: the page says so and offers to try again.
 */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return async () => {
    const session = inject(Session);
    const router = inject(Router);
    const user = await session.whenKnown();
    if (user && roles.includes(user.role)) return true;
    const needs = roles.join(',');
    // The page asked for, so signing in (or trying again) can return to it.
    const from = router.currentNavigation()?.extractedUrl.toString() ?? '/';
    const unavailable = !user && session.status() === 'unavailable' ? 1 : undefined;
    return router.createUrlTree(['/not-allowed'], { queryParams: { needs, from, unavailable } });
  };
}
