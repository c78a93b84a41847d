import type { Routes } from '@angular/router';
import { authGuard } from './core/auth/auth-guard';

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
        path: 'projects/:projectId',
        loadComponent: () => import('./features/workspace/workspace-page').then((m) => m.WorkspacePage),
        loadChildren: () => import('./features/workspace/workspace.routes').then((m) => m.workspaceRoutes),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
