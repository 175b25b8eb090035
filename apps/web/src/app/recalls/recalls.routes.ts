import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Recalls and drills: the list, opening one from a trace and one recall. Members read; only the
 * owner opens, sends notices, records replies and closes.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Recalls · Batchproof',
        loadComponent: () => import('./recall-list/recall-list'),
      },
      {
        path: 'new',
        title: 'Open a recall · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.ownerOnly)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./new-recall/new-recall'),
      },
      {
        path: ':id',
        title: 'Recall · Batchproof',
        loadComponent: () => import('./recall-page/recall-page'),
      },
    ],
  },
] satisfies Routes;
