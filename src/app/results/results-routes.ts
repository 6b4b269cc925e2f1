import { Routes } from '@angular/router';
import { projectPermissionGuard } from '../core/access-guards';

/** Child routes of the project's Shear results section. */
export const resultsRoutes: Routes = [
  { path: '', loadComponent: () => import('./result-sets/result-sets').then((m) => m.ResultSets) },
  {
    path: 'import',
    title: 'Import shear results',
    canActivate: [projectPermissionGuard('results.upload')],
    loadComponent: () => import('./results-import/results-import').then((m) => m.ResultsImport),
  },
  {
    path: ':resultSetId',
    title: 'Member matching',
    loadComponent: () => import('./matching-report/matching-report').then((m) => m.MatchingReport),
  },
];
