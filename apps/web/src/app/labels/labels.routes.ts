import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * The labels area, loaded only when opened: print runs and stocks, a stock's form, and the print
 * page for a released version. Members read; the owner and formulators print and add stocks (the
 * pages hide those actions from everyone else).
 */
const labelsRoutes: Routes = [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Labels · Batchproof',
        loadComponent: () => import('./labels-page/labels-page'),
      },
      {
        path: 'print',
        title: 'Print labels · Batchproof',
        loadComponent: () => import('./print-page/print-page'),
      },
      {
        path: 'stocks/new',
        title: 'New label stock · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./label-stock-form/label-stock-form'),
      },
      {
        path: 'stocks/:id',
        title: 'Label stock · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./label-stock-form/label-stock-form'),
      },
    ],
  },
];

export default labelsRoutes;
