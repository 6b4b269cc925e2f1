import { Routes } from '@angular/router';
import { adminGuard, NOT_FOUND_PATH, projectPermissionGuard, signedInGuard } from './core/access-guards';

export const appRoutes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'projects' },
  {
    path: 'sign-in',
    title: 'Sign in',
    loadComponent: () => import('./auth/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'invitations/:token',
    title: 'Accept invitation',
    loadComponent: () => import('./auth/accept-invitation/accept-invitation').then((m) => m.AcceptInvitation),
  },
  {
    path: 'reset-password',
    title: 'Reset password',
    loadComponent: () =>
      import('./auth/reset-password-request/reset-password-request').then((m) => m.ResetPasswordRequest),
  },
  {
    path: 'reset-password/:token',
    title: 'Choose a new password',
    loadComponent: () =>
      import('./auth/reset-password-confirm/reset-password-confirm').then((m) => m.ResetPasswordConfirm),
  },
  {
    path: 'projects',
    title: 'Projects',
    canActivate: [signedInGuard],
    loadComponent: () => import('./projects/project-list/project-list').then((m) => m.ProjectList),
  },
  {
    path: 'projects/:projectId',
    canActivate: [projectPermissionGuard('project.read')],
    loadComponent: () => import('./projects/project-shell/project-shell').then((m) => m.ProjectShell),
    loadChildren: () => import('./projects/project-routes').then((m) => m.projectRoutes),
  },
  {
    path: 'admin/users',
    title: 'Users',
    canActivate: [adminGuard],
    loadComponent: () => import('./admin/user-admin/user-admin').then((m) => m.UserAdmin),
  },
  {
    // Site admins only; the server answers 404 unless its development mail server is on, and the page says so.
    path: 'dev/outbox',
    title: 'Outbox',
    canActivate: [adminGuard],
    loadComponent: () => import('./outbox/outbox/outbox').then((m) => m.Outbox),
  },
  {
    path: NOT_FOUND_PATH.slice(1),
    title: 'Not found',
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
  {
    path: '**',
    title: 'Not found',
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
];
