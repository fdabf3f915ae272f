import { Routes } from '@angular/router';

/** The quality reviewer's pages: the queue, and one proposal to decide on (the e-mail links here). */
export const REVIEWS_ROUTES: Routes = [
  {
    path: '',
    loadComponent: () => import('./review-queue/review-queue').then((m) => m.ReviewQueue),
  },
  {
    path: ':id',
    title: 'Review',
    loadComponent: () => import('./review-page/review-page').then((m) => m.ReviewPage),
  },
];
