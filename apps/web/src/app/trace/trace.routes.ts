import type { Routes } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { roleGuard } from '../auth/role-guard';

/**
 * Tracing: pick a supplier lot or a finished lot, then trace forward (supplier lot → batches →
 * customers) or backward (finished lot → supplier lots, suppliers and documents; its customers).
 * Members read; the graph library loads with these pages only.
 */
export default [
  {
    path: '',
    canActivate: [roleGuard(ROLE_SETS.members)],
    children: [
      {
        path: '',
        title: 'Trace · Batchproof',
        loadComponent: () => import('./trace-search-page/trace-search-page'),
      },
      {
        path: 'supplier-lots/:id',
        title: 'Trace a supplier lot · Batchproof',
        loadComponent: () => import('./supplier-lot-trace/supplier-lot-trace-page'),
      },
      {
        path: 'finished-lots/:id',
        title: 'Trace a finished lot · Batchproof',
        loadComponent: () => import('./finished-lot-trace/finished-lot-trace-page'),
      },
    ],
  },
] satisfies Routes;
