import { createBrowserRouter, redirect, type RouteObject } from 'react-router';
import { queryClient, SESSION_LAPSED_EVENT } from '@/lib/query-client';
import { PROJECT_DETAIL_ROUTES } from './project-detail-routes';
import { PROJECT_TABS, type ProjectTab } from './project-tabs';
import { PageLoading } from './layout/page-loading';
import { RouteError } from './layout/route-error';
import { signInPathFor } from './sign-in-path';

function tabRoute(tab: ProjectTab): RouteObject {
  const lazy =
    tab.screen ??
    (async () => {
      const { LaterRelease } = await import('./routes/later-release');
      return { Component: () => <LaterRelease tab={tab} /> };
    });
  return tab.path === ''
    ? { index: true, lazy, ErrorBoundary: RouteError }
    : { path: tab.path, lazy, ErrorBoundary: RouteError };
}

/** Every screen is its own lazy chunk; loaders fetch through the same query options the screens read. */
export const routes: RouteObject[] = [
  { path: '/sign-in', lazy: () => import('./routes/sign-in'), ErrorBoundary: RouteError, HydrateFallback: PageLoading },
  {
    path: '/forgot-password',
    lazy: () => import('./routes/forgot-password'),
    ErrorBoundary: RouteError,
    HydrateFallback: PageLoading,
  },
  {
    path: '/reset-password',
    lazy: () => import('./routes/reset-password'),
    ErrorBoundary: RouteError,
    HydrateFallback: PageLoading,
  },
  {
    path: '/invitations/:token',
    lazy: () => import('./routes/invitation-accept'),
    ErrorBoundary: RouteError,
    HydrateFallback: PageLoading,
  },
  {
    path: '/',
    lazy: () => import('./routes/app-layout'),
    ErrorBoundary: RouteError,
    HydrateFallback: PageLoading,
    children: [
      // The inbox is the first screen after sign-in: what waits on me across all jobs.
      { index: true, loader: () => redirect('/inbox'), Component: () => null },
      { path: 'inbox', lazy: () => import('./routes/inbox'), ErrorBoundary: RouteError },
      { path: 'jobs', lazy: () => import('./routes/jobs'), ErrorBoundary: RouteError },
      { path: 'mailbox', lazy: () => import('./routes/mailbox'), ErrorBoundary: RouteError },
      { path: 'account/password', lazy: () => import('./routes/account-password'), ErrorBoundary: RouteError },
      { path: 'company', lazy: () => import('./routes/company'), ErrorBoundary: RouteError },
      {
        path: 'projects/:projectId',
        lazy: () => import('./routes/project-shell'),
        ErrorBoundary: RouteError,
        children: [...PROJECT_TABS.map(tabRoute), ...PROJECT_DETAIL_ROUTES],
      },
      { path: '*', lazy: () => import('./routes/not-found') },
    ],
  },
];

export function createRouter() {
  const router = createBrowserRouter(routes);
  window.addEventListener(SESSION_LAPSED_EVENT, () => {
    const { pathname, search } = router.state.location;
    if (pathname === '/sign-in' || router.state.navigation.location?.pathname === '/sign-in') return;
    queryClient.clear();
    void router.navigate(signInPathFor(pathname, search), { replace: true });
  });
  return router;
}
