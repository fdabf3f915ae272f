import { Routes } from '@angular/router';
import { Legend, LinearScale, LineElement, PointElement, ScatterController, Filler } from 'chart.js';
import { provideCharts } from 'ng2-charts';

/**
 * The layup pages: list, compare, and the composer (/layups/new for a new
 * layup, /layups/:layupId[?revision=id] for a saved one; one route, so saving
 * a new layup keeps the page). Chart.js gets only the parts the plots use,
 * and only in this lazy chunk.
 */
export const LAYUP_ROUTES: Routes = [
  {
    path: '',
    providers: [
      provideCharts({ registerables: [ScatterController, LineElement, PointElement, LinearScale, Legend, Filler] }),
    ],
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Layups',
        loadComponent: () => import('./list/layup-list').then((m) => m.LayupList),
      },
      {
        path: 'compare',
        title: 'Compare layups',
        loadComponent: () => import('./compare/layup-compare').then((m) => m.LayupCompare),
      },
      {
        path: ':layupId',
        title: 'Layup',
        loadComponent: () => import('./composer/layup-composer').then((m) => m.LayupComposer),
      },
    ],
  },
];
