import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { BoardView } from '../../../../shared/schemas/board';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { useBoardTones } from '../api/get-board-tones';
import { boardRows, shownLooksOf, sortRows, swatchName, type BoardSort } from '../lib/board-rows';

/**
 * A board as it is being looked at: the looks and merge thresholds chosen (starting from the saved ones),
 * the tones computed for them, and the rows joined with the swatches and ordered for the chips.
 */
export function useBoardView(pid: number, b: BoardView | undefined, swatches: readonly SwatchView[] | undefined) {
  const [lookIds, setLookIds] = useState<number[]>([]);
  const [thresholds, setThresholds] = useState({ mergeStops: 1 / 3, mergeDeltaE: 10 });
  // the chosen order is kept in the address (?sort=…&by=<look id>), so it survives a reload, a link and the way back
  const [search, setSearch] = useSearchParams();
  const sortParam = search.get('sort');
  const sort: BoardSort = sortParam === 'name' || sortParam === 'eye' ? sortParam : 'tone';
  const sortLook = Number(search.get('by') ?? 0) || 0;
  const setParam = (k: string, v: string | null) => setSearch((q) => { const n = new URLSearchParams(q); if (v === null) n.delete(k); else n.set(k, v); return n; }, { replace: true });
  const setSort = (s: BoardSort) => setParam('sort', s === 'tone' ? null : s);
  const setSortLook = (id: number) => setParam('by', id ? String(id) : null);
  useEffect(() => {
    if (b) {
      setLookIds(b.lookIds);
      setThresholds({ mergeStops: b.mergeStops, mergeDeltaE: b.mergeDeltaE });
    }
  }, [b]);
  const tones = useBoardTones(pid, b ? b.id : 0, { looks: lookIds.length ? lookIds : undefined, ...thresholds });
  const data = tones.data?.tones;
  const swatchById = useMemo(() => new Map((swatches ?? []).map((s) => [s.id, s])), [swatches]);
  const shownLooks = useMemo(() => shownLooksOf(data?.looks ?? [], lookIds), [data, lookIds]);
  const orderLook = shownLooks.find((l) => l.lookId === sortLook) ?? shownLooks[0];
  const rows = useMemo(() => (b && data ? boardRows(b.swatchIds, swatchById, shownLooks) : []), [b, data, shownLooks, swatchById]);
  const ordered = useMemo(() => sortRows(rows, sort, orderLook?.lookId), [rows, sort, orderLook]);
  return {
    lookIds, setLookIds, thresholds, setThresholds, sort, setSort, setSortLook,
    tones, data, swatchById, nameOf: (id: number) => swatchName(swatchById, id), shownLooks, orderLook, rows, ordered,
  };
}
