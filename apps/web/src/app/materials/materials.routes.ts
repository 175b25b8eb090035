import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/** The materials area: the list, a new material, and one material with its documents. */
const materialsRoutes: Routes = [
  {
    path: '',
    title: 'Materials · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.members)],
    loadComponent: () => import('./material-list/material-list'),
  },
  {
    path: 'new',
    title: 'New material · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.writers)],
    canDeactivate: [unsavedChangesGuard],
    loadComponent: () => import('./material-page/material-page'),
  },
  {
    path: ':id',
    title: 'Material · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.members)],
    canDeactivate: [unsavedChangesGuard],
    loadComponent: () => import('./material-page/material-page'),
  },
];

export default materialsRoutes;
