import { useEffect, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useLooks } from '../../features/looks/api/get-looks';
import { useLookAnalyses } from '../../features/looks/api/get-look-analysis';
import { FactorLine, LookPathLine } from '../../features/looks/components/look-summary';
import { LightBudgetPanel, RelativeLightLine } from '../../features/looks/components/light-budget-panel';
import { useLightBudget } from '../../features/looks/api/get-light-budget';
import { SpectraChart } from '../../features/bench/components/spectra-chart';
import { useBoards } from '../../features/boards/api/get-boards';
import { useBoardTones } from '../../features/boards/api/get-board-tones';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { SplitChip } from '../../components/ui/split-chip';
import { MAX_COMPARE_LOOKS } from '../../../shared/schemas/look';
import { paths } from '../../lib/paths';
import { mergeNames, mergesById } from '../../lib/merge-names';

export default function LooksComparePage() {
  const pid = Number(useParams().productionId);
  const [search] = useSearchParams();
  const ids = (search.get('ids') ?? '').split(',').map(Number).filter((n) => Number.isInteger(n) && n > 0).slice(0, MAX_COMPARE_LOOKS);
  const prod = useProduction(pid);
  const looks = useLooks(pid);
  const analyses = useLookAnalyses(pid, ids);
  const boards = useBoards(pid);
  const swatches = useSwatches(pid);
  const [boardId, setBoardId] = useState(0);
  useEffect(() => {
    if (!boardId && boards.data?.boards.length) {
      const mine = boards.data.boards.find((b) => b.department === prod.data?.production.myDepartment);
      setBoardId((mine ?? boards.data.boards[0]).id);
    }
  }, [boards.data, boardId, prod.data]);
  const tones = useBoardTones(pid, boardId, { looks: ids });
  // one row order for every column: by swatch name, or by the tone through a chosen look (lightest first)
  const [sortBy, setSortBy] = useState<'name' | number>('name');
  const byLook = sortBy === 'name' ? null : tones.data?.tones.looks.find((x) => x.lookId === sortBy);
  const stopsOf = new Map((byLook?.tones ?? []).map((t) => [t.swatchId, t.stops]));
  const budget = useLightBudget(pid, { lookIds: ids });
  const swatchById = new Map((swatches.data?.swatches ?? []).map((s) => [s.id, s]));
  const rowOrder = [...new Set((tones.data?.tones.looks ?? []).flatMap((l) => l.tones.map((t) => t.swatchId)))].sort((a, b) =>
    byLook ? (stopsOf.get(b) ?? -Infinity) - (stopsOf.get(a) ?? -Infinity) : (swatchById.get(a)?.name ?? '').localeCompare(swatchById.get(b)?.name ?? ''),
  );

  if (looks.isPending) return <Spinner />;
  const cols = ids.length <= 2 ? 'lg:grid-cols-2' : ids.length === 3 ? 'lg:grid-cols-3' : 'lg:grid-cols-4';
  return (
    <>
      <PageHeader
        title="Compare looks"
        subtitle={<>Side by side, through the same board. <Link to={paths.production(pid).looks()} className="text-accent underline">Choose other looks</Link>.</>}
        actions={
          <div className="flex flex-wrap items-center gap-3">
          <label className="flex items-center gap-2 text-sm">
            Rows
            <select aria-label="Order of the rows" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm" value={String(sortBy)} onChange={(e) => setSortBy(e.target.value === 'name' ? 'name' : Number(e.target.value))}>
              <option value="name">by swatch</option>
              {ids.map((id) => <option key={id} value={id}>lightest first through {looks.data?.looks.find((l) => l.id === id)?.name ?? `look ${id}`}</option>)}
            </select>
          </label>
          <label className="flex items-center gap-2 text-sm">
            Board
            <select className="rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm" value={boardId} onChange={(e) => setBoardId(Number(e.target.value))}>
              {boards.data?.boards.map((b) => <option key={b.id} value={b.id}>{b.name} ({b.department})</option>)}
            </select>
          </label>
          </div>
        }
      />
      <ErrorMessage error={tones.error} />
      {ids.length > 1 && <LightBudgetPanel pid={pid} lookIds={ids} title="Light budget of these looks" />}
      <div className={`grid gap-4 ${cols}`}>
        {ids.map((id, i) => {
          const look = looks.data?.looks.find((l) => l.id === id);
          const a = analyses[i]?.data?.analysis;
          const t = tones.data?.tones.looks.find((x) => x.lookId === id);
          const merges = mergesById(t);
          const nameOf = (sid: number) => swatchById.get(sid)?.name ?? '';
          return (
            <Card key={id} className="min-w-0">
              <h2 className="mb-1"><Link to={paths.production(pid).bench(id)} className="hover:text-accent">{look?.name ?? `Look ${id}`}</Link></h2>
              {budget.data && <RelativeLightLine budget={budget.data} lookId={id} className="mb-2" />}
              {a ? (
                <div className="grid gap-3">
                  <LookPathLine analysis={a} />
                  <FactorLine analysis={a} />
                  <SpectraChart analysis={a} height={200} />
                </div>
              ) : <Spinner />}
              {t && (
                <div className="mt-3 grid grid-cols-2 gap-2">
                  {rowOrder.map((sid) => {
                    const tone = t.tones.find((x) => x.swatchId === sid);
                    const s = swatchById.get(sid);
                    return s && tone ? <SplitChip key={tone.swatchId} name={s.name} hex={s.hex} tone={tone} {...mergeNames(merges.get(tone.swatchId), nameOf)} size="sm" /> : null;
                  })}
                </div>
              )}
            </Card>
          );
        })}
      </div>
    </>
  );
}
