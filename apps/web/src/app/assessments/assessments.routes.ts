import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';
import { unsavedChangesGuard } from '../forms/unsaved-changes';

/**
 * Safety assessments: the list (shares waiting and assessments), the maker's safety notes of a
 * version (writers) and one assessment with its packet, the assessor's inputs, Part B and signing.
 * Owners, formulators and viewers read every assessment; an assessor only those shared with them.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.assessments)],
    children: [
      {
        path: '',
        title: 'Assessments · Batchproof',
        loadComponent: () => import('./assessment-list/assessment-list'),
      },
      {
        path: 'notes/:formulaId/:n',
        title: 'Safety notes · Batchproof',
        canActivate: [roleGuard(ROLE_SETS.writers)],
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./safety-notes/safety-notes-page'),
      },
      {
        path: ':id',
        title: 'Assessments · Batchproof',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./assessment-page/assessment-page'),
      },
    ],
  },
] satisfies Routes;
