import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';

/**
 * Market readiness per product and market. Members read; owners and formulators record the
 * notification and listing references.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Readiness · Batchproof',
        loadComponent: () => import('./readiness-page/readiness-page'),
      },
    ],
  },
] satisfies Routes;
