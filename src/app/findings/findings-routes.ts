import { Routes } from '@angular/router';

/** Child routes of the project's Findings section. */
export const findingsRoutes: Routes = [
  { path: '', loadComponent: () => import('./findings-list/findings-list').then((m) => m.FindingsList) },
  { path: ':findingId', title: 'Finding', loadComponent: () => import('./finding-detail/finding-detail').then((m) => m.FindingDetail) },
];
