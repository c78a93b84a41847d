import type { Routes } from '@angular/router';
import { unsavedChangesGuard } from '../../shared/unsaved-changes';

export const workspaceRoutes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'spaces' },
  {
    path: 'setup',
    canDeactivate: [unsavedChangesGuard],
    title: 'Set-up · Allowlight',
    loadComponent: () => import('../setup/setup-page').then((m) => m.SetupPage),
  },
  {
    path: 'spaces',
    canDeactivate: [unsavedChangesGuard],
    title: 'Spaces · Allowlight',
    loadComponent: () => import('../spaces/spaces-page').then((m) => m.SpacesPage),
  },
  {
    path: 'luminaires',
    canDeactivate: [unsavedChangesGuard],
    title: 'Luminaires · Allowlight',
    loadComponent: () => import('../luminaires/luminaires-page').then((m) => m.LuminairesPage),
  },
  {
    path: 'allowances',
    canDeactivate: [unsavedChangesGuard],
    title: 'Allowances · Allowlight',
    loadComponent: () => import('../allowances/allowances-page').then((m) => m.AllowancesPage),
  },
  {
    path: 'controls',
    canDeactivate: [unsavedChangesGuard],
    title: 'Controls · Allowlight',
    loadComponent: () => import('../controls/controls-page').then((m) => m.ControlsPage),
  },
  {
    path: 'daylight',
    canDeactivate: [unsavedChangesGuard],
    title: 'Daylight · Allowlight',
    loadComponent: () => import('../daylight/daylight-page').then((m) => m.DaylightPage),
  },
  {
    path: 'exterior',
    canDeactivate: [unsavedChangesGuard],
    title: 'Exterior · Allowlight',
    loadComponent: () => import('../exterior/exterior-page').then((m) => m.ExteriorPage),
  },
  { path: 'results', title: 'Results · Allowlight', loadComponent: () => import('../results/results-page').then((m) => m.ResultsPage) },
  { path: 'review', title: 'Review · Allowlight', loadComponent: () => import('../review/review-page').then((m) => m.ReviewPage) },
  {
    path: 'compare',
    title: 'Compare editions · Allowlight',
    loadComponent: () => import('../compare/compare-page').then((m) => m.ComparePage),
  },
  { path: 'package', title: 'Package · Allowlight', loadComponent: () => import('../package/package-page').then((m) => m.PackagePage) },
  {
    path: 'field-tests',
    title: 'Field tests · Allowlight',
    loadComponent: () => import('../field-tests/field-tests-page').then((m) => m.FieldTestsPage),
  },
  { path: 'history', title: 'History · Allowlight', loadComponent: () => import('../history/history-page').then((m) => m.HistoryPage) },
];
