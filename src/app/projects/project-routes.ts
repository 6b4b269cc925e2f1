import { Route, Routes } from '@angular/router';
import { projectPermissionGuard } from '../core/access-guards';
import { ProjectAction } from '../core/permissions';

/** One entry of the project navigation; the same permission guards its route. */
export interface ProjectSection {
  path: string;
  label: string;
  icon: string;
  permission: ProjectAction;
}

export const projectSections: readonly ProjectSection[] = [
  { path: '', label: 'Overview', icon: 'space_dashboard', permission: 'project.read' },
  { path: 'models', label: 'Models', icon: 'deployed_code', permission: 'model.read' },
  { path: 'shear-results', label: 'Shear results', icon: 'table_rows', permission: 'model.read' },
  { path: 'checks', label: 'Checks', icon: 'fact_check', permission: 'check.read' },
  { path: '3d-view', label: '3D view', icon: 'view_in_ar', permission: 'model.read' },
  { path: 'findings', label: 'Findings', icon: 'flag', permission: 'check.read' },
  { path: 'members', label: 'Members', icon: 'group', permission: 'project.read' },
];

function section(path: string): ProjectSection {
  return projectSections.find((entry) => entry.path === path)!;
}

function sectionRoute(path: string, route: Omit<Route, 'path'>): Route {
  const entry = section(path);
  return { path, title: entry.label, canActivate: [projectPermissionGuard(entry.permission)], ...route };
}

/** Child routes of `/projects/:projectId`: the overview and one lazy route per section. */
export const projectRoutes: Routes = [
  sectionRoute('', {
    pathMatch: 'full',
    loadComponent: () => import('./project-overview/project-overview').then((m) => m.ProjectOverview),
  }),
  sectionRoute('models', { loadChildren: () => import('../models/models-routes').then((m) => m.modelsRoutes) }),
  sectionRoute('shear-results', { loadChildren: () => import('../results/results-routes').then((m) => m.resultsRoutes) }),
  sectionRoute('checks', { loadChildren: () => import('../checks/checks-routes').then((m) => m.checksRoutes) }),
  sectionRoute('3d-view', { loadComponent: () => import('../viewer/viewer-page').then((m) => m.ViewerPage) }),
  sectionRoute('findings', { loadChildren: () => import('../findings/findings-routes').then((m) => m.findingsRoutes) }),
  sectionRoute('members', {
    loadComponent: () => import('./project-members/project-members').then((m) => m.ProjectMembers),
  }),
];
