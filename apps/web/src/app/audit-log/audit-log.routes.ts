import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';

/** The audit log: who changed what and when. The owner only. */
export default [
  {
    path: '',
    title: 'Audit log · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.ownerOnly)],
    loadComponent: () => import('./audit-log-page/audit-log-page'),
  },
] satisfies Routes;
