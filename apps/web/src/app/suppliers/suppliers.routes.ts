import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/** The suppliers area: the list, a new supplier, and one supplier. */
const suppliersRoutes: Routes = [
  {
    path: '',
    title: 'Suppliers · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.members)],
    loadComponent: () => import('./supplier-list/supplier-list'),
  },
  {
    path: 'new',
    title: 'New supplier · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.writers)],
    canDeactivate: [unsavedChangesGuard],
    loadComponent: () => import('./supplier-page/supplier-page'),
  },
  {
    path: ':id',
    title: 'Supplier · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.members)],
    canDeactivate: [unsavedChangesGuard],
    loadComponent: () => import('./supplier-page/supplier-page'),
  },
];

export default suppliersRoutes;
