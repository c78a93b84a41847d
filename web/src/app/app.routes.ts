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
    ],
  },
  { path: '**', redirectTo: '' },
];
