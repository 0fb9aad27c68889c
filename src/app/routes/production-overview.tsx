import { Link, useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { ZoneRamp } from '../../components/ui/zone-ramp';
import { useProduction } from '../../features/productions/api/get-production';
import { ProductionSettings } from '../../features/productions/components/production-settings';
import { paths, type ProductionPaths } from '../../lib/paths';

/** Department → where to start. Feature links are added as features land. */
const STARTS: { title: string; text: string; to: (p: ProductionPaths) => string }[] = [
  // OVERVIEW LINKS START
  { title: 'Bench', text: 'Build a look as its light path: light, filters, medium, development, print; see the filter factor for each light.', to: (p) => p.bench() },
  { title: 'Looks', text: 'The saved looks, side by side: up to four compared through the same board.', to: (p) => p.looks() },
  { title: 'Boards', text: "Each department's swatches as grey: zones, shifts, and the colours that merge.", to: (p) => p.boards() },
  { title: 'Swatches', text: 'Add a lip colour, a fabric or a paint by colour or measured file, and see its zone through every look.', to: (p) => p.swatches() },
  { title: 'Library', text: 'Built-in lights, filters and media, and your own curves from files, forms and gels.', to: (p) => p.library() },
  { title: 'Photos', text: 'Reference photos through the looks: live preview while you retune, compare, wipe, zone map, reading a region, full-resolution renders.', to: (p) => p.photos() },
  // OVERVIEW LINKS END
  { title: 'Team', text: 'Members, roles, departments and invitations.', to: (p) => p.team() },
];

export default function ProductionOverviewPage() {
  const pid = Number(useParams().productionId);
  const q = useProduction(pid);
  if (q.isPending) return <Spinner />;
  if (q.isError) return <ErrorMessage error={q.error} />;
  const p = q.data.production;
  return (
    <>
      <PageHeader
        title={p.name}
        subtitle={<>You are {p.myRole} in {p.myDepartment}. {p.memberCount} members.{p.isDemo && ' Invented demo production.'}</>}
      />
      <p className="mb-6 max-w-3xl text-ink-soft">{p.description}</p>
      <div className="mb-8 max-w-3xl"><ZoneRamp /></div>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {STARTS.map((s) => (
          <Link key={s.title} to={s.to(paths.production(pid))}>
            <Card className="h-full hover:border-accent">
              <h2>{s.title}</h2>
              <p className="mt-1 text-sm text-ink-soft">{s.text}</p>
            </Card>
          </Link>
        ))}
      </div>
      {p.myRole === 'owner' && <div className="mt-10"><ProductionSettings production={p} /></div>}
    </>
  );
}
