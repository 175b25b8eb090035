import type { Routes } from '@angular/router';

/** The read-only reference lists: an index, then one filterable list per key. */
export default [
  {
    path: '',
    title: 'Reference lists · Batchproof',
    loadComponent: () => import('./reference-list-index/reference-list-index'),
  },
  {
    path: ':key',
    title: 'Reference list · Batchproof',
    loadComponent: () => import('./reference-list-page/reference-list-page'),
  },
] satisfies Routes;
