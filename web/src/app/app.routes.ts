import type { Routes } from '@angular/router';
import { authGuard } from './core/auth/auth-guard';
import { unsavedChangesGuard } from './shared/unsaved-changes';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Allowlight',
    loadComponent: () => import('./features/sign-in/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: '',
    canActivate: [authGuard],
    loadComponent: () => import('./core/layout/shell').then((m) => m.Shell),
    children: [
      {
        path: '',
        title: 'Projects · Allowlight',
        loadComponent: () => import('./features/projects/projects-page').then((m) => m.ProjectsPage),
      },
      {
        path: 'account',
        title: 'Account · Allowlight',
        loadComponent: () => import('./features/account/account-page').then((m) => m.AccountPage),
      },
      {
        path: 'projects/new',
        title: 'New project · Allowlight',
        canDeactivate: [unsavedChangesGuard],
        loadComponent: () => import('./features/setup/setup-wizard').then((m) => m.SetupWizard),
      },
      {
        path: 'projects/:projectId',
        loadComponent: () => import('./features/workspace/workspace-page').then((m) => m.WorkspacePage),
        loadChildren: () => import('./features/workspace/workspace.routes').then((m) => m.workspaceRoutes),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
