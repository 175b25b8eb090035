import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';

/** The workshop area: for now, its members. */
const membersRoutes: Routes = [
  {
    path: '',
    title: 'Workshop members · Batchproof',
    canActivate: [roleGuard(ROLE_SETS.members)],
    loadComponent: () => import('./members-page/members-page'),
  },
];

export default membersRoutes;
