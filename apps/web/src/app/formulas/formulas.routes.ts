import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * The formulas area: the list, a formula's versions in the editor, and comparisons. Members
 * read; the owner and formulators write (the pages hide write actions from everyone else). The
 * assessor sees nothing here yet.
 */
const formulasRoutes: Routes = [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Formulas · Batchproof',
        loadComponent: () => import('./formula-list/formula-list-page'),
      },
      {
        path: ':id/compare',
        title: 'Compare versions · Batchproof',
        loadComponent: () => import('./formula-compare/formula-compare-page'),
      },
      {
        path: ':id/identity',
        title: 'Product identity · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('../labels/product-identity/product-identity-page'),
      },
      {
        path: ':id/versions/:n',
        title: 'Formula · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./formula-editor/formula-page'),
      },
      {
        path: ':id',
        title: 'Formula · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./formula-editor/formula-page'),
      },
    ],
  },
];

export default formulasRoutes;
