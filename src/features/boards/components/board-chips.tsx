import { Card } from '../../../components/ui/card';
import { SplitChip } from '../../../components/ui/split-chip';
import type { LookTones } from '../../../../shared/schemas/board';
import { mergedIds } from '../lib/board-rows';
import type { BoardRow } from './board-table';
import { MergeList } from './merge-list';
import { ZoneRuler } from './zone-ruler';
import { useWindowRows } from '../hooks/use-window-rows';

/** The board as chips: a zone ruler per look, the merges per look, and a split chip per swatch and look. */
export function BoardChips({ looks, rows, nameOf, hexOf }: { looks: LookTones[]; rows: BoardRow[]; nameOf: (id: number) => string; hexOf: (id: number) => string }) {
  const cols = Math.max(1, looks.length);
  const grid = { gridTemplateColumns: `repeat(${cols}, minmax(0, 1fr))` };
  const win = useWindowRows<HTMLDivElement>(rows.length, cols > 2 ? 120 : 140);
  const chipsOf = (row: BoardRow) =>
    looks.map((l) => {
      const x = row.looks[l.lookId];
      return x ? <SplitChip key={`${row.id}-${l.lookId}`} name={row.name} hex={row.hex} tone={x.tone} mergesWith={x.mergesWith} mayMergeWith={x.mayMergeWith} moreMerges={x.moreMerges} moreMayMerge={x.moreMayMerge} estimated={row.spectrum === 'estimated'} size={cols > 2 ? 'sm' : 'md'} /> : <div key={`${row.id}-${l.lookId}`} />;
    });
  return (
    <>
      <Card className="mb-4">
        <h2 className="mb-1 text-base">Zone ruler</h2>
        {looks.map((l) => {
          const merged = mergedIds(l);
          return (
            <div key={l.lookId} className="mb-2">
              <p className="text-xs font-medium text-ink-soft">{l.lookName} <span className="text-ink-mute tabular">· filter {l.filterStops.toFixed(2)} st</span></p>
              <ZoneRuler title={`Zone ruler through ${l.lookName}`} pins={l.tones.map((t) => ({ id: t.swatchId, name: nameOf(t.swatchId), hex: hexOf(t.swatchId), tone: t, merged: merged.get(t.swatchId) ?? null }))} />
            </div>
          );
        })}
      </Card>
      <div className="mb-4 grid gap-4" style={grid}>
        {looks.map((l) => (
          <div key={l.lookId} className="min-w-0">
            <h2 className="mb-1 truncate text-base" title={l.lookName}>{l.lookName}</h2>
            <MergeList look={l} nameOf={nameOf} />
          </div>
        ))}
      </div>
      {win.on ? (
        // a long board: one grid per row of chips, drawn only near the view
        <div ref={win.ref} className="relative" style={{ height: win.totalPx }} aria-label="Swatches through each look" aria-rowcount={rows.length}>
          {win.items.map((it) => (
            <div key={it.key} data-index={it.index} ref={win.virtualizer.measureElement} className="absolute left-0 right-0 top-0 grid gap-2 pb-2" style={{ ...grid, transform: `translateY(${it.start - win.scrollMargin}px)` }}>
              {chipsOf(rows[it.index])}
            </div>
          ))}
        </div>
      ) : (
        <div className="grid gap-2" style={grid} aria-label="Swatches through each look">
          {rows.map(chipsOf)}
        </div>
      )}
    </>
  );
}
