import { inject } from '@angular/core';
import { type CanActivateFn, Router, type RouterStateSnapshot } from '@angular/router';
import type { Role } from '@batchproof/shared';
import { Session } from './session';

/**
 * Lets through only members whose role is in `roles` (one of the shared `ROLE_SETS`); anyone else
 * lands on the "not open to your role" page, which names the page and the roles that may open it.
 */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return (_route, state) =>
    inject(Session).hasRole(roles) ||
    inject(Router).createUrlTree(['/not-open'], {
      queryParams: { page: pageName(state), roles: roles.join(' ') },
    });
}

/** The page asked for, by its title ("Record goods-in"), or its address when it has none. */
function pageName(state: RouterStateSnapshot): string {
  let route = state.root;
  while (route.firstChild) route = route.firstChild;
  const title = route.routeConfig?.title;
  return typeof title === 'string' ? title.replace(/ · Batchproof$/, '') : state.url;
}
