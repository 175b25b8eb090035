import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Lets signed-in users through; sends everyone else to sign in, and back here afterwards. */
export const authGuard: CanActivateFn = async (_route, state) => {
  const session = inject(Session);
  const router = inject(Router);
  await session.restore();
  if (session.signedIn()) return true;
  const queryParams = state.url === '/' ? {} : { next: state.url };
  return router.createUrlTree(['/sign-in'], { queryParams });
};
