import { Routes } from '@angular/router';

/** Allowables: the list with its CSV download, and one allowable with its history, chain and impact. */
export const ALLOWABLES_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./allowable-list/allowable-list').then((m) => m.AllowableList),
  },
  {
    path: ':id',
    title: 'Allowable',
    loadComponent: () => import('./allowable-detail/allowable-detail').then((m) => m.AllowableDetailPage),
  },
];
