import { Routes } from '@angular/router';

/** Child routes of the project's Checks section. */
export const checksRoutes: Routes = [
  { path: '', loadComponent: () => import('./check-runs/check-runs').then((m) => m.CheckRuns) },
  { path: ':runId', title: 'Check run', loadComponent: () => import('./check-run/check-run').then((m) => m.CheckRunPage) },
  {
    path: ':runId/members/:globalId',
    title: 'Calculation sheet',
    loadComponent: () => import('./calculation-sheet/calculation-sheet').then((m) => m.CalculationSheet),
  },
];
