import { useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { Segmented } from '../../components/ui/segmented';
import { useMember } from '../../features/productions/hooks/use-member';
import { useBoard } from '../../features/boards/api/get-board';
import { useUpdateBoard } from '../../features/boards/api/update-board';
import { useLooks } from '../../features/looks/api/get-looks';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { useBoardView } from '../../features/boards/hooks/use-board-view';
import { BoardTable, sortingFromText, sortingToText } from '../../features/boards/components/board-table';
import { boardQueryOptions } from '../../features/boards/api/get-board';
import { useCurves } from '../../features/library/api/get-curves';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { useUpdateSwatch } from '../../features/swatches/api/update-swatch';
import { ShadeFinder, type ShadeOrigin } from '../../features/shade/components/shade-finder';
import { sourcedLooks } from '../../lib/look-sources';
import type { SwatchCreateInput, SwatchView } from '../../../shared/schemas/swatch';
import { BoardSettings } from '../../features/boards/components/board-settings';
import { BoardChips } from '../../features/boards/components/board-chips';
import { BoardSortControls } from '../../features/boards/components/board-sort';
import { SwatchChooser } from '../../features/boards/components/swatch-chooser';
import { boardFileName, measureFirst, mergeCount, settingsDirty } from '../../features/boards/lib/board-rows';
import { MeasureFirstList } from '../../features/boards/components/measure-first';
import { mayChangeDepartmentItem } from '../../../shared/policy/department';
import { paths } from '../../lib/paths';

type View = 'chips' | 'table';

export default function BoardPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const { member } = useMember(pid);
  const board = useBoard(pid, Number(params.boardId));
  const looks = useLooks(pid);
  const swatches = useSwatches(pid);
  const update = useUpdateBoard(pid);
  const b = board.data?.board;
  const v = useBoardView(pid, b, swatches.data?.swatches);
  const [search, setSearch] = useSearchParams();
  const setParam = (k: string, val: string | null) => setSearch((q) => { const n = new URLSearchParams(q); if (val === null) n.delete(k); else n.set(k, val); return n; }, { replace: true });
  const view: View = search.get('view') === 'table' ? 'table' : 'chips';
  const setView = (x: View) => setParam('view', x === 'chips' ? null : x);
  const tableSorting = sortingFromText(search.get('tsort'));
  const [editSwatches, setEditSwatches] = useState(false);
  const [finding, setFinding] = useState(false);
  const qc = useQueryClient();
  const curves = useCurves(pid);
  const create = useCreateSwatch(pid);
  const updateSwatch = useUpdateSwatch(pid);
  const allSwatches = swatches.data?.swatches;
  const sourced = useMemo(() => sourcedLooks(looks.data?.looks ?? [], curves.data?.curves ?? [], allSwatches ?? []), [looks.data, curves.data, allSwatches]);

  if (board.isPending || looks.isPending) return <Spinner />;
  if (!b) return <ErrorMessage error={board.error} />;
  const canEdit = mayChangeDepartmentItem(member, b.department);
  const { data, tones, shownLooks } = v;
  const merges = mergeCount(shownLooks);
  const onBoard = b.swatchIds.map((id) => v.swatchById.get(id)).filter((x): x is SwatchView => !!x);
  const shownIds = shownLooks.map((l) => l.lookId);
  const finderLooks = [...sourced.filter((l) => shownIds.includes(l.id)), ...sourced.filter((l) => !shownIds.includes(l.id))];
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: boardQueryOptions(pid, b.id).queryKey }), tones.refetch()]);

  /** A kept shade: a new swatch in the board's department, put on this board. */
  async function keep(from: SwatchView, name: string, origin: ShadeOrigin) {
    const input = { name, department: from.department, notes: `The shade of ${from.name} found for a zone.`, origin, lightStops: from.lightStops ?? 0 } as SwatchCreateInput;
    const { swatch } = await create.mutateAsync({ pid, ...input });
    await update.mutateAsync({ pid, id: b!.id, swatchIds: [...b!.swatchIds, swatch.id] });
    await refresh();
    return { id: swatch.id, name: swatch.name, boards: [{ id: b!.id, name: b!.name, href: paths.production(pid).board(b!.id) }] };
  }

  return (
    <>
      <PageHeader
        title={b.name}
        subtitle={<>{b.department} board · {b.swatchIds.length.toLocaleString('en')} swatches · {merges.certain ? <span className="font-medium text-warn">{merges.certain.toLocaleString('en')} merge{merges.certain > 1 ? 's' : ''} flagged</span> : 'no certain merges'}{merges.possible > 0 && <> · <span className="text-warn/80">{merges.possible.toLocaleString('en')} possible</span></>}{b.notes && <> · {b.notes}</>}</>}
        actions={<Link to={paths.production(pid).boards()} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">All boards</Link>}
      />
      <Card className="mb-4">
        <BoardSettings board={b} looks={(looks.data?.looks ?? []).map((l) => ({ id: l.id, name: l.name }))} lookIds={v.lookIds} onLooks={v.setLookIds}
          mergeStops={v.thresholds.mergeStops} mergeDeltaE={v.thresholds.mergeDeltaE} onThresholds={v.setThresholds} canEdit={canEdit}
          dirty={settingsDirty(b, v.lookIds, v.thresholds)} saving={update.isPending} onSave={() => update.mutate({ pid, id: b.id, lookIds: v.lookIds, ...v.thresholds })} />
        <ErrorMessage error={update.error ?? tones.error} />
      </Card>

      <div className="mb-3 flex flex-wrap items-center gap-3 text-sm" role="toolbar" aria-label="Board view">
        <Segmented label="Show as" value={view} onChange={setView} options={[['chips', 'Chips'], ['table', 'Table']]} />
        {view === 'chips' && <BoardSortControls sort={v.sort} onSort={v.setSort} looks={shownLooks} lookId={v.orderLook?.lookId ?? 0} onLook={v.setSortLook} />}
        {tones.isFetching && <span className="text-xs text-ink-mute" role="status">computing…</span>}
        {data && <span className="ml-auto text-xs text-ink-mute tabular">computed in {data.ms.toFixed(0)} ms on the server</span>}
        {canEdit && <button type="button" className="rounded-md border border-paper-line bg-paper-raised px-3 py-1 hover:bg-paper-sunk" aria-expanded={finding} onClick={() => setFinding((x) => !x)}>Find the shade for a zone</button>}
        {canEdit && <button type="button" className="rounded-md border border-paper-line bg-paper-raised px-3 py-1 hover:bg-paper-sunk" aria-expanded={editSwatches} onClick={() => setEditSwatches((x) => !x)}>Choose swatches</button>}
      </div>

      {finding && canEdit && onBoard.length > 0 && finderLooks.length > 0 && (
        <div className="mb-4">
          <ShadeFinder swatches={onBoard} swatchId={onBoard[0].id} looks={finderLooks} mayKeep={canEdit} mayReplace={(s) => mayChangeDepartmentItem(member, s.department)}
            title="Find the shade for a zone (kept shades go on this board)"
            onKeep={keep} onReplace={(s, origin) => updateSwatch.mutateAsync({ pid, id: s.id, origin: origin as SwatchCreateInput['origin'] }).then(refresh)} />
        </div>
      )}

      {editSwatches && canEdit && (
        <SwatchChooser swatches={swatches.data?.swatches ?? []} chosen={b.swatchIds} onChange={(swatchIds) => update.mutate({ pid, id: b.id, swatchIds })} />
      )}

      {data && shownLooks.length > 0 && <MeasureFirstList items={measureFirst(v.rows, shownLooks)} />}

      {!data && tones.isPending && <Spinner label="Computing tones…" />}
      {data && shownLooks.length === 0 && <p className="text-ink-mute">Choose at least one look to see this board through.</p>}
      {data && view === 'chips' && shownLooks.length > 0 && (
        <div className={tones.isPlaceholderData ? 'opacity-75 transition-opacity' : ''} aria-busy={tones.isFetching}>
          <BoardChips looks={shownLooks} rows={v.ordered} nameOf={v.nameOf} hexOf={(id) => v.swatchById.get(id)?.hex ?? '#000'} />
        </div>
      )}
      {data && view === 'table' && <BoardTable rows={v.rows} looks={shownLooks.map((l) => ({ id: l.lookId, name: l.lookName }))} fileName={boardFileName(b.name)} sorting={tableSorting} onSorting={(x) => setParam('tsort', x.length ? sortingToText(x) : null)} />}
    </>
  );
}
