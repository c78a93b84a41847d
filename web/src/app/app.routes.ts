import type { Routes } from '@angular/router';
import { adminGuard, authGuard } from './core/auth/auth-guard';
import { unsavedChangesGuard } from './shared/unsaved-changes';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Allowlight',
    loadComponent: () => import('./features/sign-in/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password · Allowlight',
    loadComponent: () => import('./features/sign-in/forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'reset-password',
    title: 'Choose a new password · Allowlight',
    loadComponent: () => import('./features/sign-in/reset-password-page').then((m) => m.ResetPasswordPage),
  },
  {
    path: 'invitation',
    title: 'Join a project · Allowlight',
    loadComponent: () => import('./features/sign-in/invitation-page').then((m) => m.InvitationPage),
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
        path: 'review',
        title: 'Review desk · Allowlight',
        loadComponent: () => import('./features/review/review-desk-page').then((m) => m.ReviewDeskPage),
      },
      {
        path: 'people',
        title: 'People · Allowlight',
        canActivate: [adminGuard],
        loadComponent: () => import('./features/people/people-page').then((m) => m.PeoplePage),
      },
      {
        path: 'outbox',
        title: 'Outbox · Allowlight',
        canActivate: [adminGuard],
        loadComponent: () => import('./features/outbox/outbox-page').then((m) => m.OutboxPage),
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
