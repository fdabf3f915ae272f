import { Routes } from '@angular/router';

import { TestDataPage } from './test-data';

/**
 * Test data: the coupon table, the CSV upload, and the analyses of data groups
 * (pages/analyses), under one set of tabs.
 */
export const TEST_DATA_ROUTES: Routes = [
  {
    path: '',
    component: TestDataPage,
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'coupons' },
      {
        path: 'coupons',
        title: 'Coupons',
        loadComponent: () => import('./coupons/coupon-table').then((m) => m.CouponTable),
      },
      {
        path: 'upload',
        title: 'Upload coupons',
        loadComponent: () => import('./upload/upload-page').then((m) => m.UploadPage),
      },
      {
        path: 'analyses',
        title: 'Analyses',
        loadComponent: () => import('../analyses/analysis-list/analysis-list').then((m) => m.AnalysisList),
      },
      {
        path: 'analyses/new',
        title: 'New analysis',
        loadComponent: () => import('../analyses/analysis-new/analysis-new').then((m) => m.AnalysisNew),
      },
      {
        path: 'analyses/:id',
        title: 'Analysis',
        loadComponent: () => import('../analyses/analysis-page/analysis-page').then((m) => m.AnalysisPage),
      },
    ],
  },
];
