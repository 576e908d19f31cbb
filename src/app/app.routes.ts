import { Routes } from '@angular/router';
import { roleGuard, signedInGuard, signedOutGuard, startPageGuard } from './auth/auth-guards';

/** Top-level routes: the public sign-in page, and everything else inside the signed-in shell. */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./auth/sign-in-page').then((m) => m.SignInPage),
  },
  // Public letter verification: no guard, outside the signed-in shell (the page draws its own header).
  { path: 'verify', title: 'Verify a letter', loadComponent: () => import('./verify/verify-page').then((m) => m.VerifyPage) },
  { path: 'verify/:code', title: 'Verify a letter', loadComponent: () => import('./verify/verify-page').then((m) => m.VerifyPage) },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    children: [
      { path: '', pathMatch: 'full', canActivate: [startPageGuard], children: [] },
      {
        path: 'requests/mine',
        title: 'My requests',
        canActivate: [roleGuard('submitter')],
        data: { scope: 'mine' },
        loadComponent: () => import('./requests/request-queue-page').then((m) => m.RequestQueuePage),
      },
      {
        path: 'requests/assigned',
        title: 'Assigned to me',
        canActivate: [roleGuard('reviewer')],
        data: { scope: 'assigned' },
        loadComponent: () => import('./requests/request-queue-page').then((m) => m.RequestQueuePage),
      },
      {
        path: 'requests/intake',
        title: 'Intake queue',
        canActivate: [roleGuard('head')],
        loadComponent: () => import('./intake/intake-queue-page').then((m) => m.IntakeQueuePage),
      },
      {
        path: 'requests/:id/assign',
        title: 'Assign a reviewer',
        canActivate: [roleGuard('head')],
        loadComponent: () => import('./intake/assign-page').then((m) => m.AssignPage),
      },
      {
        path: 'workload',
        title: 'Workload',
        canActivate: [roleGuard('head')],
        loadComponent: () => import('./workload/workload-page').then((m) => m.WorkloadPage),
      },
      {
        path: 'office/settings',
        title: 'Office settings',
        canActivate: [roleGuard('head', 'reviewer', 'admin')],
        loadComponent: () => import('./office-settings/office-settings-page').then((m) => m.OfficeSettingsPage),
      },
      {
        path: 'me/expertise',
        title: 'My expertise',
        canActivate: [roleGuard('reviewer')],
        loadComponent: () => import('./workload/my-expertise-page').then((m) => m.MyExpertisePage),
      },
      {
        path: 'admin/outbox',
        title: 'Outbox',
        canActivate: [roleGuard('admin')],
        loadComponent: () => import('./outbox/outbox-page').then((m) => m.OutboxPage),
      },
      {
        path: 'requests/new',
        title: 'New review request',
        canActivate: [roleGuard('submitter')],
        loadComponent: () => import('./filing/filing-page').then((m) => m.FilingPage),
      },
      {
        path: 'requests/:id/edit',
        title: 'Edit request',
        canActivate: [roleGuard('submitter')],
        loadComponent: () => import('./filing/filing-page').then((m) => m.FilingPage),
      },
      {
        path: 'requests/:id/review',
        title: 'Review',
        canActivate: [roleGuard('reviewer', 'head')],
        loadComponent: () => import('./review/review-page').then((m) => m.ReviewPage),
      },
      {
        path: 'requests/:id',
        title: 'Request',
        loadComponent: () => import('./request-detail/request-detail-page').then((m) => m.RequestDetailPage),
      },
      {
        path: 'admin',
        canActivate: [roleGuard('admin')],
        loadChildren: () => import('./admin/admin-routes').then((m) => m.ADMIN_ROUTES),
      },
      { path: 'not-allowed', title: 'Not available', loadComponent: () => import('./shell/not-found-page').then((m) => m.NotFoundPage), data: { reason: 'roles' } },
      { path: '**', title: 'Not found', loadComponent: () => import('./shell/not-found-page').then((m) => m.NotFoundPage) },
    ],
  },
];
