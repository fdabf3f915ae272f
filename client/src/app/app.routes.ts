import { Routes } from '@angular/router';

import { PAGE_AUDIENCE } from './core/session/page-access';
import { roleGuard } from './core/session/role-guard';
import { signedInGuard } from './core/session/signed-in-guard';

/** Every page is loaded on first visit, so the first download holds only the shell. */
export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Home',
    canActivate: [signedInGuard],
    loadComponent: () => import('./pages/home/home').then((m) => m.HomePage),
  },
  {
    path: 'materials',
    title: 'Materials',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.materials },
    loadComponent: () => import('./pages/materials/materials').then((m) => m.MaterialsPage),
  },
  {
    path: 'test-data',
    title: 'Test data',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE['test-data'] },
    loadComponent: () => import('./pages/test-data/test-data').then((m) => m.TestDataPage),
  },
  {
    path: 'allowables',
    title: 'Allowables',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.allowables },
    loadComponent: () => import('./pages/allowables/allowables').then((m) => m.AllowablesPage),
  },
  {
    path: 'reviews',
    title: 'Reviews',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.reviews },
    loadComponent: () => import('./pages/reviews/reviews').then((m) => m.ReviewsPage),
  },
  {
    path: 'layups',
    title: 'Layups',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.layups },
    loadComponent: () => import('./pages/layups/layups').then((m) => m.LayupsPage),
  },
  {
    path: 'sections',
    title: 'Sections',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.sections },
    loadComponent: () => import('./pages/sections/sections').then((m) => m.SectionsPage),
  },
  {
    path: 'administration',
    title: 'Administration',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.administration },
    loadComponent: () =>
      import('./pages/administration/administration').then((m) => m.AdministrationPage),
  },
  {
    path: 'sign-in',
    title: 'Sign in',
    loadComponent: () => import('./pages/sign-in/sign-in').then((m) => m.SignInPage),
  },
  {
    path: 'not-permitted',
    title: 'Not permitted',
    canActivate: [signedInGuard],
    loadComponent: () =>
      import('./pages/not-permitted/not-permitted').then((m) => m.NotPermittedPage),
  },
  {
    path: '**',
    title: 'Page not found',
    loadComponent: () => import('./pages/not-found/not-found').then((m) => m.NotFoundPage),
  },
];
