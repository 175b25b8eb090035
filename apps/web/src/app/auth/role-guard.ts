import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import type { Role } from '@batchproof/shared';
import { Session } from './session';

/** Lets through only members whose role is in `roles` (one of the shared `ROLE_SETS`). */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return () => inject(Session).hasRole(roles) || inject(Router).createUrlTree(['/']);
}
