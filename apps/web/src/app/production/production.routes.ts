import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Production: the batches list, starting a batch and one batch record. Members read; owners,
 * formulators and production start and record batches; owners and formulators release them.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Production · Batchproof',
        loadComponent: () => import('./batch-list/batch-list'),
      },
      {
        path: 'new',
        title: 'Start a batch · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        loadComponent: () => import('./new-batch/new-batch-page'),
      },
      {
        path: ':id',
        title: 'Batch record · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./batch-page/batch-page'),
      },
    ],
  },
] satisfies Routes;
