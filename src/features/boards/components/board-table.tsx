import { useMemo } from 'react';
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable, type SortingState } from '@tanstack/react-table';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import type { SwatchTone } from '../../../../shared/schemas/board';
import { greyCss, signedStops } from '../../../lib/tone-format';
import { downloadText, toCsv } from '../lib/board-csv';
import { RangeBar } from '../../../components/ui/range-bar';
import { isExact, WIDE_WIDTH, widthOf, zoneSpanWords } from '../../../lib/tone-range';
import type { MergeNames } from '../../../lib/merge-names';
import { useWindowRows } from '../hooks/use-window-rows';

export interface BoardRow {
  id: number;
  name: string;
  department: string;
  hex: string;
  spectrum: SwatchView['spectrum'];
  /** per look id: its tone and the names it merges with (whatever the spectra) and may merge with, and how many more */
  looks: Record<number, { tone: SwatchTone } & MergeNames>;
}

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const helper = createColumnHelper<typeof features, BoardRow>();

/** At most two names, then how many more (the names listed are in the cell's title and the CSV). */
const fewNames = (names: string[], more = 0) => {
  const rest = Math.max(0, names.length - 2) + more;
  return rest ? `${names.slice(0, 2).join(', ')} +${rest} more` : names.join(', ');
};
/** Names, then how many more the server counted beyond those it listed. */
const allNames = (names: string[], more: number) => `${names.join(', ')}${more > 0 ? ` and ${more} more` : ''}`;

/** Names for the CSV, then how many more the server counted. */
const csvNames = (names: string[], more: number) => [...names, ...(more > 0 ? [`and ${more} more`] : [])].join('; ');

/** A table sort as text for the address: "zone-3:desc,name:asc". */
export const sortingToText = (s: SortingState) => s.map((x) => `${x.id}:${x.desc ? 'desc' : 'asc'}`).join(',');
export const sortingFromText = (t: string | null): SortingState =>
  (t ?? '').split(',').filter(Boolean).map((p) => { const [id, dir] = p.split(':'); return { id, desc: dir === 'desc' }; });

/**
 * The board as a table: sortable columns (TanStack Table), the order kept by the caller (in the address),
 * a CSV export of what is shown in that order; one column group per look, so three looks fit a laptop's width.
 */
export function BoardTable({ rows, looks, fileName, sorting, onSorting }: { rows: BoardRow[]; looks: { id: number; name: string }[]; fileName: string; sorting: SortingState; onSorting: (s: SortingState) => void }) {
  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor('name', {
          header: 'Swatch',
          sortFn: 'alphanumeric',
          cell: (c) => {
            const r = c.row.original;
            return (
              <span className="flex min-w-[8rem] items-center gap-2">
                <span aria-hidden="true" className="inline-block h-6 w-6 shrink-0 rounded-sm border border-paper-line" style={{ background: r.hex }} title={`${r.hex} to the eye`} />
                <span className="min-w-0">
                  <span className="block font-medium">{r.name}</span>
                  <span className="block text-[11px] text-ink-mute">{r.department} · {r.hex} · {r.spectrum}</span>
                </span>
              </span>
            );
          },
        }),
        ...looks.flatMap((l) => [
          helper.accessor((r) => r.looks[l.id]?.tone.zone ?? null, {
            id: `zone-${l.id}`,
            header: `Zone · ${l.name}`,
            sortUndefined: 'last',
            cell: (c) => {
              const t = c.row.original.looks[l.id]?.tone;
              return t ? (
                <span className="inline-flex items-start gap-1.5">
                  <span className="mt-0.5 inline-block h-5 w-5 shrink-0 rounded-sm border border-paper-line" style={{ background: greyCss(t.grey) }} />
                  <span className="flex flex-col leading-tight">
                    <span className="whitespace-nowrap"><span className="font-semibold">{t.numeral}</span> <span className="text-[11px] text-ink-mute">{t.zone.toFixed(1)} · {signedStops(t.stops)}</span></span>
                    <span className="whitespace-nowrap text-[11px] text-ink-mute">shift {signedStops(t.shift)}</span>
                  </span>
                </span>
              ) : '—';
            },
          }),
          helper.accessor((r) => { const t = r.looks[l.id]?.tone; return t ? widthOf(t.range.plausible) : null; }, {
            id: `range-${l.id}`,
            header: `Could read · ${l.name}`,
            sortUndefined: 'last',
            cell: (c) => {
              const x = c.row.original.looks[l.id];
              const t = x?.tone;
              if (!t) return '—';
              const exact = isExact(t.range);
              const w = widthOf(t.range.plausible);
              return (
                <span className="flex flex-col gap-0.5">
                  <span className="inline-flex items-center gap-1.5" data-testid="row-range">
                    <RangeBar range={t.range} stops={t.stops} className="w-14" />
                    <span className={`whitespace-nowrap text-[11px] ${exact ? 'text-accent' : w >= WIDE_WIDTH ? 'font-semibold text-warn' : ''}`}>{exact ? 'measured' : `${zoneSpanWords(t.range.plausible)} (${w.toFixed(1)} st)`}</span>
                  </span>
                  {x.mergesWith.length > 0 && <span className="text-[11px] text-warn" title={allNames(x.mergesWith, x.moreMerges)}><span className="font-semibold">merges:</span> {fewNames(x.mergesWith, x.moreMerges)}</span>}
                  {x.mayMergeWith.length > 0 && <span className="text-[11px] text-warn/75" title={allNames(x.mayMergeWith, x.moreMayMerge)}><span className="font-medium">may merge:</span> {fewNames(x.mayMergeWith, x.moreMayMerge)}</span>}
                </span>
              );
            },
          }),
        ]),
      ]),
    [looks],
  );
  const table = useTable({ features, columns, data: rows, getRowId: (r) => String(r.id), state: { sorting }, onSortingChange: (u) => onSorting(typeof u === 'function' ? u(sorting) : u) });

  const all = table.getRowModel().rows;
  const win = useWindowRows<HTMLTableSectionElement>(all.length, 64);
  // a long board draws only the rows near the view, with spacer rows keeping the table's height
  const shown = win.on ? win.items.map((it) => ({ row: all[it.index], index: it.index })) : all.map((row, index) => ({ row, index }));
  const padTop = win.on && win.items.length ? win.items[0].start - win.scrollMargin : 0;
  const padBottom = win.on && win.items.length ? win.totalPx - (win.items[win.items.length - 1].end - win.scrollMargin) : 0;
  const span = all[0]?.getAllCells().length ?? 1;

  function exportCsv() {
    const header = ['swatch', 'department', 'colour', 'spectrum', ...looks.flatMap((l) => [`zone (${l.name})`, `zone numeral (${l.name})`, `stops (${l.name})`, `eye stops (${l.name})`, `shift stops (${l.name})`, `grey 0-255 (${l.name})`, `plausible low stops (${l.name})`, `plausible high stops (${l.name})`, `possible low stops (${l.name})`, `possible high stops (${l.name})`, `merges with (${l.name})`, `may merge with (${l.name})`])];
    const data = table.getRowModel().rows.map((row) => {
      const r = row.original;
      return [r.name, r.department, r.hex, r.spectrum, ...looks.flatMap((l) => {
        const x = r.looks[l.id];
        const rg = x?.tone.range;
        return x && rg
          ? [x.tone.zone.toFixed(2), x.tone.numeral, x.tone.stops.toFixed(2), x.tone.eyeStops.toFixed(2), x.tone.shift.toFixed(2), Math.round(x.tone.grey), rg.plausible[0].toFixed(2), rg.plausible[1].toFixed(2), rg.possible[0].toFixed(2), rg.possible[1].toFixed(2), csvNames(x.mergesWith, x.moreMerges), csvNames(x.mayMergeWith, x.moreMayMerge)]
          : ['', '', '', '', '', '', '', '', '', '', '', ''];
      })];
    });
    downloadText(`${fileName}.csv`, toCsv(header, data));
  }

  return (
    <div>
      <div className="mb-2 flex justify-end">
        <button type="button" className="rounded-md border border-paper-line bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk" onClick={exportCsv}>Export CSV</button>
      </div>
      <div className="overflow-x-auto rounded-lg border border-paper-line bg-paper-raised">
        <table className="w-full table-auto text-sm" aria-label="Board as a table">
          <thead className="border-b border-paper-line text-left text-xs text-ink-mute">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th key={h.id} className="px-2 py-2 align-bottom font-medium" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}>
                      {h.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 text-left hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                          <table.FlexRender header={h} />
                          <span aria-hidden="true">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        <table.FlexRender header={h} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody ref={win.ref}>
            {padTop > 0 && <tr aria-hidden="true"><td colSpan={span} style={{ height: padTop, padding: 0 }} /></tr>}
            {shown.map(({ row, index }) => (
              <tr key={row.id} data-index={index} ref={win.on ? win.virtualizer.measureElement : undefined} className="border-b border-paper-line last:border-0">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-1.5 align-top tabular"><table.FlexRender cell={cell} /></td>
                ))}
              </tr>
            ))}
            {padBottom > 0 && <tr aria-hidden="true"><td colSpan={span} style={{ height: padBottom, padding: 0 }} /></tr>}
          </tbody>
        </table>
      </div>
    </div>
  );
}
