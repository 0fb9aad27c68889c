import { lazy, Suspense, type ComponentType, type JSX } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { AppShell } from '../components/layouts/app-shell';
import { RequireSignIn } from './require-sign-in';
import { RouteError } from './route-error';
import { Spinner } from '../components/ui/alert';
import { paths } from '../lib/paths';

/** The patterns of a production's pages. */
const P = paths.production(':productionId');

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

/** Pages under /p/:productionId (absolute patterns from `paths`). Features add theirs here. */
const productionPages: RouteObject[] = [
  { index: true, ...page(() => import('./routes/production-overview')) },
  { path: P.team(), ...page(() => import('./routes/team')) },
  // PRODUCTION ROUTES START
  { path: P.sheet(':lookId'), ...page(() => import('./routes/exposure-sheet')) },
  { path: P.looks(), ...page(() => import('./routes/looks')) },
  { path: P.compare(), ...page(() => import('./routes/looks-compare')) },
  { path: P.bench(), ...page(() => import('./routes/bench')) },
  { path: P.bench(':lookId'), ...page(() => import('./routes/bench')) },
  { path: P.library(), ...page(() => import('./routes/library')) },
  { path: P.swatches(), ...page(() => import('./routes/swatches')) },
  { path: P.boards(), ...page(() => import('./routes/boards')) },
  { path: P.board(':boardId'), ...page(() => import('./routes/board')) },
  { path: P.photos(), ...page(() => import('./routes/photos')) },
  { path: P.lampPlan(), ...page(() => import('./routes/lamp-plan')) },
  { path: P.activity(), ...page(() => import('./routes/activity')) },
  // PRODUCTION ROUTES END
];

const router = createBrowserRouter([
  { path: paths.signIn(), ...page(() => import('./routes/sign-in')) },
  { path: paths.setup(), ...page(() => import('./routes/setup')) },
  { path: paths.resetRequest(), ...page(() => import('./routes/reset-request')) },
  { path: paths.resetConfirm(':token'), ...page(() => import('./routes/reset-confirm')) },
  { path: paths.invitation(':token'), ...page(() => import('./routes/accept-invitation')) },
  {
    element: <RequireSignIn />,
    errorElement: <RouteError />,
    children: [
      {
        element: <AppShell />,
        errorElement: <RouteError />,
        children: [
          { path: paths.home(), ...page(() => import('./routes/productions')) },
          { path: paths.outbox(), ...page(() => import('./routes/outbox')) },
          { path: paths.account(), ...page(() => import('./routes/account')) },
          { path: P.root(), errorElement: <RouteError />, children: productionPages },
        ],
      },
    ],
  },
  { path: '*', ...page(() => import('./routes/not-found')) },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
