import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import { Session } from './session';

/** Keeps signed-in users off the sign-in and sign-up pages. */
export const guestGuard: CanActivateFn = async () => {
  const session = inject(Session);
  const router = inject(Router);
  await session.restore();
  return session.signedIn() ? router.createUrlTree(['/']) : true;
};
