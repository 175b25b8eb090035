import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';

/**
 * Safety assessments: the list (shares waiting and assessments) and one assessment with its
 * packet, the assessor's inputs, Part B and signing. PLACEHOLDER until the pages land.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.assessments)],
    children: [],
  },
] satisfies Routes;
