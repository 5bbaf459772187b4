import type { RouteObject } from 'react-router';
import { RouteError } from './layout/route-error';

/** Screens under a project that are not tabs of their own: one tally, one pay application. */
export const PROJECT_DETAIL_ROUTES: RouteObject[] = [
  { path: 'tallies/:tallyId', lazy: () => import('./routes/project-tally'), ErrorBoundary: RouteError },
  { path: 'pay-apps/:payAppId', lazy: () => import('./routes/project-pay-app'), ErrorBoundary: RouteError },
  {
    path: 'change-orders/:changeOrderId',
    lazy: () => import('./routes/project-change-order'),
    ErrorBoundary: RouteError,
  },
];
