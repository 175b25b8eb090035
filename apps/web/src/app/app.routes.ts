import type { Routes } from '@angular/router';
import { authGuard } from './auth/auth-guard';
import authRoutes from './auth/auth.routes';

/** Top-level routes: the signed-out pages, then everything inside the signed-in shell. */
export const routes: Routes = [
  ...authRoutes,
  {
    path: '',
    loadComponent: () => import('./shell/shell'),
    canActivate: [authGuard],
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Home · Batchproof',
        loadComponent: () => import('./home/home-page/home-page'),
      },
      { path: 'workshop', loadChildren: () => import('./members/members.routes') },
      { path: 'formulas', loadChildren: () => import('./formulas/formulas.routes') },
      { path: 'materials', loadChildren: () => import('./materials/materials.routes') },
      { path: 'suppliers', loadChildren: () => import('./suppliers/suppliers.routes') },
      { path: 'lots', loadChildren: () => import('./lots/lots.routes') },
      { path: 'labels', loadChildren: () => import('./labels/labels.routes') },
      { path: 'production', loadChildren: () => import('./production/production.routes') },
      { path: 'deliveries', loadChildren: () => import('./deliveries/deliveries.routes') },
      { path: 'trace', loadChildren: () => import('./trace/trace.routes') },
      { path: 'recalls', loadChildren: () => import('./recalls/recalls.routes') },
      { path: 'complaints', loadChildren: () => import('./complaints/complaints.routes') },
      { path: 'assessments', loadChildren: () => import('./assessments/assessments.routes') },
      { path: 'readiness', loadChildren: () => import('./readiness/readiness.routes') },
      { path: 'audit-log', loadChildren: () => import('./audit-log/audit-log.routes') },
      { path: 'reference', loadChildren: () => import('./reference-lists/reference-lists.routes') },
      {
        path: 'not-open',
        title: 'Not open to your role · Batchproof',
        loadComponent: () => import('./auth/not-open-page/not-open-page'),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
