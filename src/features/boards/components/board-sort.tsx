import type { LookTones } from '../../../../shared/schemas/board';
import type { BoardSort } from '../lib/board-rows';

const select = 'rounded-md border border-paper-line bg-paper-raised px-2 py-1';

/** How the chips are ordered: by tone on the medium or to the eye (through which look), or by name. */
export function BoardSortControls({ sort, onSort, looks, lookId, onLook }: { sort: BoardSort; onSort: (s: BoardSort) => void; looks: LookTones[]; lookId: number; onLook: (id: number) => void }) {
  return (
    <>
      <label className="flex items-center gap-1">Sort by
        <select className={select} value={sort} onChange={(e) => onSort(e.target.value as BoardSort)}>
          <option value="tone">tone on the medium, light to dark</option>
          <option value="eye">tone to the eye, light to dark</option>
          <option value="name">name</option>
        </select>
      </label>
      {sort !== 'name' && looks.length > 1 && (
        <label className="flex items-center gap-1">through
          <select className={select} value={lookId} onChange={(e) => onLook(Number(e.target.value))}>
            {looks.map((l) => <option key={l.lookId} value={l.lookId}>{l.lookName}</option>)}
          </select>
        </label>
      )}
    </>
  );
}
