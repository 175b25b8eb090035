import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Complaints and adverse events: the list, a new complaint and one complaint. Members read;
 * owners, formulators and production log and update them; the assessor has no access.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Complaints · Batchproof',
        loadComponent: () => import('./complaint-list/complaint-list'),
      },
      {
        path: 'new',
        title: 'Log a complaint · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./complaint-page/complaint-page'),
      },
      {
        path: ':id',
        title: 'Complaint · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./complaint-page/complaint-page'),
      },
    ],
  },
] satisfies Routes;
