import { Routes } from '@angular/router';

/** The catalogue pages: the material systems, and one system with its batches, panels and ply data. */
export const MATERIALS_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./material-list/material-list').then((m) => m.MaterialList),
  },
  {
    path: ':id',
    title: 'Material',
    loadComponent: () => import('./material-detail/material-detail').then((m) => m.MaterialDetailPage),
  },
];
