import { Routes } from '@angular/router';

/** Administration pages (the parent route already requires the admin role). */
export const ADMIN_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'people' },
  { path: 'people', title: 'People and roles', loadComponent: () => import('./people-page').then((m) => m.PeoplePage) },
  { path: 'sign-in-mappings', title: 'Sign-in mappings', loadComponent: () => import('./sign-in-mappings-page').then((m) => m.SignInMappingsPage) },
  { path: 'audit', title: 'Audit log', loadComponent: () => import('./audit-log-page').then((m) => m.AuditLogPage) },
];
