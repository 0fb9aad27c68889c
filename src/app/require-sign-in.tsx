import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { useMe } from '../features/auth/api/get-me';
import { Spinner } from '../components/ui/alert';
import { paths } from '../lib/paths';

/** Routes inside need a session; otherwise to /sign-in (or /setup on an empty site). */
export function RequireSignIn() {
  const me = useMe();
  const loc = useLocation();
  if (me.isPending) return <div className="p-10"><Spinner /></div>;
  if (me.isError) throw me.error;
  if (!me.data.user) {
    if (me.data.needsSetup) return <Navigate to={paths.setup()} replace />;
    return <Navigate to={paths.signIn(loc.pathname + loc.search)} replace />;
  }
  return <Outlet />;
}
