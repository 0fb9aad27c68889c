import { NavLink, Outlet, useNavigate, useParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { useProductions } from '../../features/productions/api/get-productions';
import { useProduction } from '../../features/productions/api/get-production';
import { Logo } from '../ui/logo';
import { DemoBanner } from './demo-banner';
import { paths, type ProductionPaths } from '../../lib/paths';

const navCls = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-2.5 py-1 text-sm ${isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-sunk'}`;

/** Production-level pages, in menu order. Features add their entries here; `owner` ones show to owners only. */
const PRODUCTION_NAV: { to: (p: ProductionPaths) => string; label: string; end?: boolean; owner?: true }[] = [
  { to: (p) => p.root(), label: 'Overview', end: true },
  // NAV START
  { to: (p) => p.looks(), label: 'Looks' },
  { to: (p) => p.bench(), label: 'Bench' },
  { to: (p) => p.boards(), label: 'Boards' },
  { to: (p) => p.swatches(), label: 'Swatches' },
  { to: (p) => p.library(), label: 'Library' },
  { to: (p) => p.photos(), label: 'Photos' },
  { to: (p) => p.lampPlan(), label: 'Lamp plan' },
  // NAV END
  { to: (p) => p.team(), label: 'Team' },
  { to: (p) => p.activity(), label: 'Activity', owner: true },
];

export function AppShell() {
  const me = useMe();
  const productions = useProductions();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const { productionId } = useParams();
  const pid = Number(productionId ?? 0);
  const user = me.data?.user;
  const isOwner = useProduction(pid).data?.production.myRole === 'owner';

  return (
    <div className="min-h-screen">
      <DemoBanner />
      <header className="no-print sticky top-0 z-20 border-b border-paper-line bg-paper/95 backdrop-blur">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-3 px-4 py-2">
          <NavLink to={paths.home()} className="flex items-center gap-2 font-semibold tracking-tight" aria-label="Grisaille, all productions">
            <Logo /> Grisaille
          </NavLink>
          <label className="sr-only" htmlFor="production-switcher">Production</label>
          <select
            id="production-switcher"
            className="max-w-[16rem] rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm"
            value={pid || ''}
            onChange={(e) => navigate(e.target.value ? paths.production(e.target.value).root() : paths.home())}
          >
            <option value="">All productions…</option>
            {productions.data?.productions.map((p) => (
              <option key={p.id} value={p.id}>{p.name}</option>
            ))}
          </select>
          {pid > 0 && (
            <nav className="flex flex-wrap gap-1" aria-label="Production">
              {PRODUCTION_NAV.filter((n) => !n.owner || isOwner).map((n) => (
                <NavLink key={n.label} to={n.to(paths.production(pid))} end={n.end} className={navCls}>{n.label}</NavLink>
              ))}
            </nav>
          )}
          <div className="ml-auto flex items-center gap-2 text-sm">
            {user?.isAdmin && me.data?.demo && <NavLink to={paths.outbox()} className={navCls}>Outbox</NavLink>}
            <NavLink to={paths.account()} className={navCls} title={`${user?.email ?? ''}: your account (password, sessions)`}>{user?.name}</NavLink>
            <button
              type="button"
              className="rounded-md px-2.5 py-1 text-ink-soft hover:bg-paper-sunk"
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn()) })}
            >
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}
