import { useMe } from '../../features/auth/api/get-me';

/**
 * A warning across the top of every page when demo mode was switched on for a public address
 * (GRISAILLE_DEMO=true with a PUBLIC_URL that is not this machine): its accounts' password is published.
 */
export function DemoBanner() {
  const me = useMe();
  if (!me.data?.demoPublic) return null;
  return (
    <div role="alert" className="no-print border-b-2 border-ink bg-ink px-4 py-2 text-center text-sm font-medium text-paper">
      Demo mode on a public address: the demo accounts' password is published and anyone can sign in with it.
      Do not keep real work here; the site operator should unset GRISAILLE_DEMO.
    </div>
  );
}
