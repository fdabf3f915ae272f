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
    loadChildren: () => import('./pages/materials/materials.routes').then((m) => m.MATERIALS_ROUTES),
  },
  {
    path: 'test-data',
    title: 'Test data',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE['test-data'] },
    loadChildren: () => import('./pages/test-data/test-data.routes').then((m) => m.TEST_DATA_ROUTES),
  },
  {
    path: 'allowables',
    title: 'Allowables',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.allowables },
    loadChildren: () => import('./pages/allowables/allowables.routes').then((m) => m.ALLOWABLES_ROUTES),
  },
  {
    path: 'reviews',
    title: 'Reviews',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.reviews },
    loadChildren: () => import('./pages/reviews/reviews.routes').then((m) => m.REVIEWS_ROUTES),
  },
  {
    path: 'layups',
    title: 'Layups',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.layups },
    loadChildren: () => import('./pages/layups/layups.routes').then((m) => m.LAYUP_ROUTES),
  },
  {
    path: 'sections',
    title: 'Sections',
    canActivate: [roleGuard],
    data: { audience: PAGE_AUDIENCE.sections },
    loadComponent: () => import('./pages/sections/section-export').then((m) => m.SectionExportPage),
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
