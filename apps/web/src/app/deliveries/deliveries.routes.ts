import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Deliveries of finished lots and the customers who receive them. Members read; owners,
 * formulators and production record deliveries, import them and keep customers.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Deliveries · Batchproof',
        loadComponent: () => import('./delivery-list/delivery-list'),
      },
      {
        path: 'new',
        title: 'New delivery · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./delivery-page/delivery-page'),
      },
      {
        path: 'import',
        title: 'Import deliveries · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        loadComponent: () => import('./delivery-import/delivery-import'),
      },
      {
        path: 'customers',
        title: 'Customers · Batchproof',
        loadComponent: () => import('./customer-list/customer-list'),
      },
      {
        path: 'customers/new',
        title: 'New customer · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.goodsIn)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./customer-page/customer-page'),
      },
      {
        path: 'customers/:id',
        title: 'Customer · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./customer-page/customer-page'),
      },
      {
        path: ':id',
        title: 'Delivery · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./delivery-page/delivery-page'),
      },
    ],
  },
] satisfies Routes;
