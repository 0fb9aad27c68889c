import { useEffect, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useBoard } from '../../features/boards/api/get-board';
import { useBoardTones } from '../../features/boards/api/get-board-tones';
import { useUpdateBoard } from '../../features/boards/api/update-board';
import { useLooks } from '../../features/looks/api/get-looks';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { SplitChip } from '../../features/boards/components/split-chip';
import { ZoneRuler } from '../../features/boards/components/zone-ruler';
import { BoardTable, type BoardRow } from '../../features/boards/components/board-table';
import { BoardSettings } from '../../features/boards/components/board-settings';
import { MergeList } from '../../features/boards/components/merge-list';
import { roleAtLeast } from '../../../shared/schemas/roles';

type View = 'chips' | 'table';
type Sort = 'tone' | 'name' | 'eye';

export default function BoardPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const boardId = Number(params.boardId);
  const prod = useProduction(pid);
  const board = useBoard(pid, boardId);
  const looks = useLooks(pid);
  const swatches = useSwatches(pid);
  const update = useUpdateBoard(pid);
  const b = board.data?.board;
  const me = prod.data?.production;
  const canEdit = !!me && !!b && (roleAtLeast(me.myRole, 'editor') || (me.myRole === 'contributor' && me.myDepartment === b.department));

  const [lookIds, setLookIds] = useState<number[]>([]);
  const [thresholds, setThresholds] = useState({ mergeStops: 1 / 3, mergeDeltaE: 10 });
  const [view, setView] = useState<View>('chips');
  const [sort, setSort] = useState<Sort>('tone');
  const [sortLook, setSortLook] = useState(0);
  const [editSwatches, setEditSwatches] = useState(false);
  useEffect(() => {
    if (b) {
      setLookIds(b.lookIds);
      setThresholds({ mergeStops: b.mergeStops, mergeDeltaE: b.mergeDeltaE });
    }
  }, [b]);
  const tones = useBoardTones(pid, b ? boardId : 0, { looks: lookIds.length ? lookIds : undefined, ...thresholds });
  const data = tones.data?.tones;
  const swatchById = useMemo(() => new Map((swatches.data?.swatches ?? []).map((s) => [s.id, s])), [swatches.data]);
  const nameOf = (id: number) => swatchById.get(id)?.name ?? `#${id}`;
  const shownLooks = useMemo(() => (data?.looks ?? []).filter((l) => !lookIds.length || lookIds.includes(l.lookId)), [data, lookIds]);
  const orderLook = shownLooks.find((l) => l.lookId === sortLook) ?? shownLooks[0];

  const rows: BoardRow[] = useMemo(() => {
    if (!b || !data) return [];
    return b.swatchIds.map((id) => {
      const s = swatchById.get(id);
      const per: BoardRow['looks'] = {};
      for (const l of shownLooks) {
        const t = l.tones.find((x) => x.swatchId === id);
        if (t) per[l.lookId] = { tone: t, mergesWith: l.merges.filter((m) => m.a === id || m.b === id).map((m) => nameOf(m.a === id ? m.b : m.a)) };
      }
      return { id, name: s?.name ?? `#${id}`, department: s?.department ?? '', hex: s?.hex ?? '#000000', spectrum: s?.spectrum ?? 'estimated', looks: per };
    });
  }, [b, data, shownLooks, swatchById]);
  const ordered = useMemo(() => {
    const r = [...rows];
    if (sort === 'name') r.sort((x, y) => x.name.localeCompare(y.name));
    else if (orderLook) {
      const key = (row: BoardRow) => (sort === 'eye' ? row.looks[orderLook.lookId]?.tone.eyeStops : row.looks[orderLook.lookId]?.tone.stops) ?? -99;
      r.sort((x, y) => key(y) - key(x));
    }
    return r;
  }, [rows, sort, orderLook]);

  if (board.isPending || looks.isPending) return <Spinner />;
  if (!b) return <ErrorMessage error={board.error} />;
  const dirty = JSON.stringify(lookIds) !== JSON.stringify(b.lookIds) || thresholds.mergeStops !== b.mergeStops || thresholds.mergeDeltaE !== b.mergeDeltaE;
  const allLooks = (looks.data?.looks ?? []).map((l) => ({ id: l.id, name: l.name }));
  const mergeCount = shownLooks.reduce((n, l) => n + l.merges.length, 0);
  const mergedIds = (lookId: number) => new Set((shownLooks.find((l) => l.lookId === lookId)?.merges ?? []).flatMap((m) => [m.a, m.b]));
  const cols = Math.max(1, shownLooks.length);

  return (
    <>
      <PageHeader
        title={b.name}
        subtitle={<>{b.department} board · {b.swatchIds.length} swatches · {mergeCount ? <span className="font-medium text-warn">{mergeCount} merge{mergeCount > 1 ? 's' : ''} flagged</span> : 'no merges'}{b.notes && <> · {b.notes}</>}</>}
        actions={<Link to={`/p/${pid}/boards`} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">All boards</Link>}
      />
      <Card className="mb-4">
        <BoardSettings board={b} looks={allLooks} lookIds={lookIds} onLooks={setLookIds} mergeStops={thresholds.mergeStops} mergeDeltaE={thresholds.mergeDeltaE}
          onThresholds={setThresholds} canEdit={canEdit} dirty={dirty} saving={update.isPending}
          onSave={() => update.mutate({ pid, id: b.id, lookIds, ...thresholds })} />
        <ErrorMessage error={update.error ?? tones.error} />
      </Card>

      <div className="mb-3 flex flex-wrap items-center gap-3 text-sm" role="toolbar" aria-label="Board view">
        <div className="flex overflow-hidden rounded-md border border-paper-line">
          {(['chips', 'table'] as const).map((v) => (
            <button key={v} type="button" aria-pressed={view === v} onClick={() => setView(v)} className={`px-3 py-1 ${view === v ? 'bg-ink text-paper' : 'bg-paper-raised hover:bg-paper-sunk'}`}>{v === 'chips' ? 'Chips' : 'Table'}</button>
          ))}
        </div>
        {view === 'chips' && (
          <>
            <label className="flex items-center gap-1">Sort by
              <select className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={sort} onChange={(e) => setSort(e.target.value as Sort)}>
                <option value="tone">tone on the medium, light to dark</option>
                <option value="eye">tone to the eye, light to dark</option>
                <option value="name">name</option>
              </select>
            </label>
            {sort !== 'name' && shownLooks.length > 1 && (
              <label className="flex items-center gap-1">through
                <select className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={orderLook?.lookId ?? 0} onChange={(e) => setSortLook(Number(e.target.value))}>
                  {shownLooks.map((l) => <option key={l.lookId} value={l.lookId}>{l.lookName}</option>)}
                </select>
              </label>
            )}
          </>
        )}
        {tones.isFetching && <span className="text-xs text-ink-mute" role="status">computing…</span>}
        {data && <span className="ml-auto text-xs text-ink-mute tabular">computed in {data.ms.toFixed(0)} ms on the server</span>}
        {canEdit && <button type="button" className="rounded-md border border-paper-line bg-paper-raised px-3 py-1 hover:bg-paper-sunk" aria-expanded={editSwatches} onClick={() => setEditSwatches((x) => !x)}>Choose swatches</button>}
      </div>

      {editSwatches && canEdit && (
        <Card className="mb-4">
          <fieldset>
            <legend className="mb-2 text-sm font-semibold">Swatches on this board (any department's, e.g. the wall behind a costume)</legend>
            <div className="grid gap-1 sm:grid-cols-2 lg:grid-cols-4">
              {(swatches.data?.swatches ?? []).map((s) => {
                const on = b.swatchIds.includes(s.id);
                return (
                  <label key={s.id} className="flex items-center gap-2 text-sm">
                    <input type="checkbox" checked={on} onChange={() => update.mutate({ pid, id: b.id, swatchIds: on ? b.swatchIds.filter((x) => x !== s.id) : [...b.swatchIds, s.id] })} />
                    <span className="h-3 w-5 rounded-sm border border-paper-line" style={{ background: s.hex }} />
                    <span className="truncate">{s.name}</span>
                    <span className="text-xs text-ink-mute">{s.department}</span>
                  </label>
                );
              })}
            </div>
          </fieldset>
        </Card>
      )}

      {!data && tones.isPending && <Spinner label="Computing tones…" />}
      {data && shownLooks.length === 0 && <p className="text-ink-mute">Choose at least one look to see this board through.</p>}
      {data && view === 'chips' && shownLooks.length > 0 && (
        <div className={tones.isPlaceholderData ? 'opacity-75 transition-opacity' : ''} aria-busy={tones.isFetching}>
          <Card className="mb-4">
            <h2 className="mb-1 text-base">Zone ruler</h2>
            {shownLooks.map((l) => {
              const merged = mergedIds(l.lookId);
              return (
                <div key={l.lookId} className="mb-2">
                  <p className="text-xs font-medium text-ink-soft">{l.lookName} <span className="text-ink-mute tabular">· filter {l.filterStops.toFixed(2)} st</span></p>
                  <ZoneRuler title={`Zone ruler through ${l.lookName}`} pins={l.tones.map((t) => ({ id: t.swatchId, name: nameOf(t.swatchId), hex: swatchById.get(t.swatchId)?.hex ?? '#000', tone: t, merged: merged.has(t.swatchId) }))} />
                </div>
              );
            })}
          </Card>
          <div className="mb-4 grid gap-4" style={{ gridTemplateColumns: `repeat(${cols}, minmax(0, 1fr))` }}>
            {shownLooks.map((l) => (
              <div key={l.lookId} className="min-w-0">
                <h2 className="mb-1 truncate text-base" title={l.lookName}>{l.lookName}</h2>
                <MergeList look={l} nameOf={nameOf} />
              </div>
            ))}
          </div>
          <div className="grid gap-2" style={{ gridTemplateColumns: `repeat(${cols}, minmax(0, 1fr))` }} aria-label="Swatches through each look">
            {ordered.map((row) =>
              shownLooks.map((l) => {
                const x = row.looks[l.lookId];
                return x ? <SplitChip key={`${row.id}-${l.lookId}`} name={row.name} hex={row.hex} tone={x.tone} mergesWith={x.mergesWith} estimated={row.spectrum === 'estimated'} size={cols > 2 ? 'sm' : 'md'} /> : <div key={`${row.id}-${l.lookId}`} />;
              }),
            )}
          </div>
        </div>
      )}
      {data && view === 'table' && <BoardTable rows={rows} looks={shownLooks.map((l) => ({ id: l.lookId, name: l.lookName }))} fileName={b.name.replace(/[^a-z0-9]+/gi, '-').toLowerCase()} />}
    </>
  );
}
