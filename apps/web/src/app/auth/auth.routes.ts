import type { Routes } from '@angular/router';
import { guestGuard } from './guest-guard';

/** The signed-out pages. The confirmation, invitation and reset paths are the links the API e-mails. */
const authRoutes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Batchproof',
    canActivate: [guestGuard],
    loadComponent: () => import('./sign-in/sign-in-page'),
  },
  {
    path: 'sign-up',
    title: 'Set up your workshop · Batchproof',
    canActivate: [guestGuard],
    loadComponent: () => import('./sign-up/sign-up-page'),
  },
  {
    path: 'confirm-sign-up/:token',
    title: 'Confirm your e-mail · Batchproof',
    loadComponent: () => import('./sign-up/confirm-sign-up-page'),
  },
  {
    path: 'accept-invite/:token',
    title: 'Join your workshop · Batchproof',
    loadComponent: () => import('./accept-invite/accept-invite-page'),
  },
  {
    path: 'reset-password',
    title: 'Reset your password · Batchproof',
    loadComponent: () => import('./reset-password/reset-request-page'),
  },
  {
    path: 'reset-password/:token',
    title: 'Choose a new password · Batchproof',
    loadComponent: () => import('./reset-password/reset-complete-page'),
  },
];

export default authRoutes;
