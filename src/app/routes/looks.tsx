import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
import { useLooks } from '../../features/looks/api/get-looks';
import { useLookAnalyses } from '../../features/looks/api/get-look-analysis';
import { useDuplicateLook } from '../../features/looks/api/duplicate-look';
import { FactorLine, LookPathLine } from '../../features/looks/components/look-summary';
import { LightBudgetPanel } from '../../features/looks/components/light-budget-panel';
import { roleAtLeast } from '../../../shared/policy/department';
import { MAX_COMPARE_LOOKS, MAX_LIGHT_BUDGET_LOOKS } from '../../../shared/schemas/look';
import { paths } from '../../lib/paths';

export default function LooksPage() {
  const pid = Number(useParams().productionId);
  const navigate = useNavigate();
  const to = paths.production(pid);
  const { member } = useMember(pid);
  const canEdit = !!member && roleAtLeast(member.role, 'editor');
  const looks = useLooks(pid);
  const ids = looks.data?.looks.map((l) => l.id) ?? [];
  const analyses = useLookAnalyses(pid, ids);
  const duplicate = useDuplicateLook(pid);
  const [picked, setPicked] = useState<number[]>([]);
  const toggle = (id: number) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length < MAX_COMPARE_LOOKS ? [...p, id] : p));

  return (
    <>
      <PageHeader
        title="Looks"
        subtitle="Saved presets: light, filters, medium, development and print. Pick up to four to compare side by side."
        actions={
          <>
            <Button disabled={picked.length < 2} onClick={() => navigate(to.compare(picked))}>Compare {picked.length ? `(${picked.length})` : ''}</Button>
            {canEdit && <Button variant="primary" onClick={() => navigate(to.bench('new'))}>New look</Button>}
          </>
        }
      />
      {looks.isPending && <Spinner />}
      <ErrorMessage error={looks.error ?? duplicate.error} />
      {looks.data?.looks.length === 0 && <p className="text-ink-mute">No looks yet.{canEdit && ' Start one on the bench.'}</p>}
      {ids.length > 1 && <LightBudgetPanel pid={pid} lookIds={ids.slice(0, MAX_LIGHT_BUDGET_LOOKS)} />}
      <div className="grid gap-4 md:grid-cols-2">
        {looks.data?.looks.map((l, i) => {
          const a = analyses[i]?.data?.analysis;
          const on = picked.includes(l.id);
          return (
            <Card key={l.id} className={on ? 'border-accent ring-1 ring-accent' : ''}>
              <div className="mb-2 flex items-start justify-between gap-2">
                <div>
                  <h2><Link to={to.bench(l.id)} className="hover:text-accent">{l.name}</Link></h2>
                  {l.notes && <p className="mt-0.5 text-sm text-ink-soft">{l.notes}</p>}
                </div>
                <label className="flex shrink-0 items-center gap-1 text-sm">
                  <input type="checkbox" checked={on} onChange={() => toggle(l.id)} disabled={!on && picked.length >= MAX_COMPARE_LOOKS} />
                  Compare
                </label>
              </div>
              {a ? (
                <div className="grid gap-2">
                  <LookPathLine analysis={a} />
                  <FactorLine analysis={a} />
                </div>
              ) : <Spinner label="Computing…" />}
              <div className="mt-3 flex gap-2">
                <Link to={to.bench(l.id)} className="rounded-md border border-paper-line bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk">Open on the bench</Link>
                {canEdit && <Button variant="ghost" onClick={() => duplicate.mutate({ pid, id: l.id }, { onSuccess: (r) => navigate(to.bench(r.look.id)) })}>Duplicate</Button>}
              </div>
            </Card>
          );
        })}
      </div>
    </>
  );
}
