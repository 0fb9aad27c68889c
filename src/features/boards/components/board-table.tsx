import { useMemo } from 'react';
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable, type SortingState } from '@tanstack/react-table';
import { useState } from 'react';
import type { SwatchTone } from '../../../../shared/schemas/board';
import { greyCss, signedStops } from '../../../lib/tone-format';
import { downloadText, toCsv } from '../lib/board-csv';
import { RangeBar } from '../../../components/ui/range-bar';
import { isExact, WIDE_WIDTH, widthOf, zoneSpanWords } from '../../../lib/tone-range';

export interface BoardRow {
  id: number;
  name: string;
  department: string;
  hex: string;
  spectrum: 'measured' | 'estimated';
  /** per look id: its tone and the names it merges with (whatever the spectra) and may merge with */
  looks: Record<number, { tone: SwatchTone; mergesWith: string[]; mayMergeWith: string[] }>;
}

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const helper = createColumnHelper<typeof features, BoardRow>();

/** The board as a table: sortable columns (TanStack Table) and a CSV export of what is shown, in its order. */
export function BoardTable({ rows, looks, fileName }: { rows: BoardRow[]; looks: { id: number; name: string }[]; fileName: string }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor('name', { header: 'Swatch', sortFn: 'alphanumeric' }),
        helper.accessor('department', { header: 'Department' }),
        helper.accessor('hex', {
          header: 'Colour',
          enableSorting: false,
          cell: (c) => <span className="inline-flex items-center gap-1"><span className="inline-block h-3 w-6 rounded-sm border border-paper-line" style={{ background: c.getValue() }} />{c.getValue()}</span>,
        }),
        helper.accessor('spectrum', { header: 'Spectrum' }),
        ...looks.flatMap((l) => [
          helper.accessor((r) => r.looks[l.id]?.tone.zone ?? null, {
            id: `zone-${l.id}`,
            header: `Zone · ${l.name}`,
            sortUndefined: 'last',
            cell: (c) => {
              const t = c.row.original.looks[l.id]?.tone;
              return t ? <span className="inline-flex items-center gap-1"><span className="inline-block h-3 w-4 rounded-sm" style={{ background: greyCss(t.grey) }} />{t.numeral} <span className="text-ink-mute">({t.zone.toFixed(1)})</span></span> : '—';
            },
          }),
          helper.accessor((r) => { const t = r.looks[l.id]?.tone; return t ? widthOf(t.range.plausible) : null; }, {
            id: `range-${l.id}`,
            header: `Could read · ${l.name}`,
            sortUndefined: 'last',
            cell: (c) => {
              const t = c.row.original.looks[l.id]?.tone;
              if (!t) return '—';
              const exact = isExact(t.range);
              const w = widthOf(t.range.plausible);
              return (
                <span className="inline-flex items-center gap-2" data-testid="row-range">
                  <RangeBar range={t.range} stops={t.stops} className="w-36" />
                  <span className={exact ? 'text-accent' : w >= WIDE_WIDTH ? 'font-semibold text-warn' : ''}>{exact ? 'measured' : zoneSpanWords(t.range.plausible)}</span>
                  {!exact && <span className="text-ink-mute">({w.toFixed(1)} st)</span>}
                </span>
              );
            },
          }),
          helper.accessor((r) => r.looks[l.id]?.tone.stops ?? null, { id: `stops-${l.id}`, header: `Stops · ${l.name}`, sortUndefined: 'last', cell: (c) => (c.getValue() === null ? '—' : signedStops(c.getValue() as number)) }),
          helper.accessor((r) => r.looks[l.id]?.tone.shift ?? null, { id: `shift-${l.id}`, header: `Shift · ${l.name}`, sortUndefined: 'last', cell: (c) => (c.getValue() === null ? '—' : signedStops(c.getValue() as number)) }),
          helper.accessor((r) => [...(r.looks[l.id]?.mergesWith ?? []), ...(r.looks[l.id]?.mayMergeWith ?? [])].join(', '), {
            id: `merge-${l.id}`,
            header: `Merges · ${l.name}`,
            cell: (c) => {
              const x = c.row.original.looks[l.id];
              if (!x) return '';
              return (
                <span className="inline-flex flex-col">
                  {x.mergesWith.length > 0 && <span className="text-warn"><span className="font-semibold">merges:</span> {x.mergesWith.join(', ')}</span>}
                  {x.mayMergeWith.length > 0 && <span className="text-warn/75"><span className="font-medium">may merge:</span> {x.mayMergeWith.join(', ')}</span>}
                </span>
              );
            },
          }),
        ]),
      ]),
    [looks],
  );
  const table = useTable({ features, columns, data: rows, getRowId: (r) => String(r.id), state: { sorting }, onSortingChange: setSorting });

  function exportCsv() {
    const header = ['swatch', 'department', 'colour', 'spectrum', ...looks.flatMap((l) => [`zone (${l.name})`, `zone numeral (${l.name})`, `stops (${l.name})`, `eye stops (${l.name})`, `shift stops (${l.name})`, `grey 0-255 (${l.name})`, `plausible low stops (${l.name})`, `plausible high stops (${l.name})`, `possible low stops (${l.name})`, `possible high stops (${l.name})`, `merges with (${l.name})`, `may merge with (${l.name})`])];
    const data = table.getRowModel().rows.map((row) => {
      const r = row.original;
      return [r.name, r.department, r.hex, r.spectrum, ...looks.flatMap((l) => {
        const x = r.looks[l.id];
        const rg = x?.tone.range;
        return x && rg
          ? [x.tone.zone.toFixed(2), x.tone.numeral, x.tone.stops.toFixed(2), x.tone.eyeStops.toFixed(2), x.tone.shift.toFixed(2), Math.round(x.tone.grey), rg.plausible[0].toFixed(2), rg.plausible[1].toFixed(2), rg.possible[0].toFixed(2), rg.possible[1].toFixed(2), x.mergesWith.join('; '), x.mayMergeWith.join('; ')]
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
        <table className="w-full text-sm">
          <thead className="border-b border-paper-line text-left text-xs text-ink-mute">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th key={h.id} className="whitespace-nowrap px-3 py-2 font-medium" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}>
                      {h.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
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
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-paper-line last:border-0">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="whitespace-nowrap px-3 py-1.5 tabular"><table.FlexRender cell={cell} /></td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
