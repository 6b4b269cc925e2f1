import { Routes } from '@angular/router';

/** Child routes of the project's Models section. */
export const modelsRoutes: Routes = [
  { path: '', loadComponent: () => import('./revision-list/revision-list').then((m) => m.RevisionList) },
  {
    path: 'compare',
    title: 'Compare revisions',
    loadComponent: () => import('./revision-compare/revision-compare').then((m) => m.RevisionCompare),
  },
  {
    path: ':revisionId',
    title: 'Revision members',
    loadComponent: () => import('./revision-members/revision-members').then((m) => m.RevisionMembers),
  },
];
