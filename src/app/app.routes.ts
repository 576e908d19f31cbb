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
        data: { scope: 'intake' },
        loadComponent: () => import('./requests/request-queue-page').then((m) => m.RequestQueuePage),
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
