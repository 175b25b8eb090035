import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Goods-in: the lots list, a new delivery and one lot. Members read; owners, formulators and
 * production record deliveries; the assessor has no access.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Lots · Batchproof',
        loadComponent: () => import('./lot-list/lot-list'),
      },
      {
        path: 'new',
        title: 'Record goods-in · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./lot-page/lot-page'),
      },
      {
        path: ':id',
        title: 'Lot · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./lot-page/lot-page'),
      },
    ],
  },
] satisfies Routes;
