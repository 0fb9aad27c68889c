import { lazy, Suspense, type ComponentType, type JSX } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { AppShell } from '../components/layouts/app-shell';
import { RequireSignIn } from './require-sign-in';
import { RouteError } from './route-error';
import { Spinner } from '../components/ui/alert';

/** Pages load lazily; each route has its own error boundary. */
function page(load: () => Promise<{ default: ComponentType }>): { element: JSX.Element; errorElement: JSX.Element } {
  const C = lazy(load);
  return {
    element: (
      <Suspense fallback={<div className="p-6"><Spinner /></div>}>
        <C />
      </Suspense>
    ),
    errorElement: <RouteError />,
  };
}

/** Pages under /p/:productionId. Features add theirs here. */
const productionPages: RouteObject[] = [
  { index: true, ...page(() => import('./routes/production-overview')) },
  { path: 'team', ...page(() => import('./routes/team')) },
  // PRODUCTION ROUTES START
  { path: 'looks/:lookId/sheet', ...page(() => import('./routes/exposure-sheet')) },
  { path: 'looks', ...page(() => import('./routes/looks')) },
  { path: 'looks/compare', ...page(() => import('./routes/looks-compare')) },
  { path: 'bench', ...page(() => import('./routes/bench')) },
  { path: 'bench/:lookId', ...page(() => import('./routes/bench')) },
  { path: 'library', ...page(() => import('./routes/library')) },
  { path: 'swatches', ...page(() => import('./routes/swatches')) },
  { path: 'boards', ...page(() => import('./routes/boards')) },
  { path: 'boards/:boardId', ...page(() => import('./routes/board')) },
  { path: 'photos', ...page(() => import('./routes/photos')) },
  // PRODUCTION ROUTES END
];

const router = createBrowserRouter([
  { path: '/sign-in', ...page(() => import('./routes/sign-in')) },
  { path: '/setup', ...page(() => import('./routes/setup')) },
  { path: '/reset', ...page(() => import('./routes/reset-request')) },
  { path: '/reset/:token', ...page(() => import('./routes/reset-confirm')) },
  { path: '/invitation/:token', ...page(() => import('./routes/accept-invitation')) },
  {
    element: <RequireSignIn />,
    errorElement: <RouteError />,
    children: [
      {
        element: <AppShell />,
        errorElement: <RouteError />,
        children: [
          { path: '/', ...page(() => import('./routes/productions')) },
          { path: '/admin/outbox', ...page(() => import('./routes/outbox')) },
          { path: '/p/:productionId', errorElement: <RouteError />, children: productionPages },
        ],
      },
    ],
  },
  { path: '*', ...page(() => import('./routes/not-found')) },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
