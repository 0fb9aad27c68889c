import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { SplitChip } from '../../../components/ui/split-chip';
import type { BoardView, LookTones } from '../../../../shared/schemas/board';
import type { Department } from '../../../../shared/schemas/roles';
import { mergeNames, mergesById } from '../../../lib/merge-names';

/** A board's swatches through the look on the bench, as the analysis answers them. */
export interface BenchBoardTones {
  tones: LookTones;
  swatches: { id: number; name: string; hex: string; estimated: boolean }[];
}

/** The board shown on the bench: chosen by the user, else the first of the member's department, else the first. */
export function useBenchBoardChoice(boards: BoardView[] | undefined, myDepartment: Department | undefined) {
  const [boardId, setBoardId] = useState<number | undefined>(undefined);
  useEffect(() => {
    if (boardId === undefined && boards?.length) {
      const mine = boards.find((b) => b.department === myDepartment);
      setBoardId((mine ?? boards[0]).id);
    }
  }, [boards, boardId, myDepartment]);
  return [boardId, setBoardId] as const;
}

/** A board through the look being edited: split chips light to dark, and a link to the board itself. */
export function BenchBoard({ boards, boardId, onBoard, chips, stale, boardLink }: {
  boards: BoardView[];
  boardId: number | undefined;
  onBoard: (id: number | undefined) => void;
  chips: BenchBoardTones | null | undefined;
  stale: boolean;
  boardLink: string | null;
}) {
  const sorted = chips ? [...chips.tones.tones].sort((a, b) => b.stops - a.stops) : [];
  const merges = mergesById(chips?.tones);
  const nameOf = (id: number) => chips?.swatches.find((s) => s.id === id)?.name ?? '';
  return (
    <>
      <div className="mb-3 flex flex-wrap items-end justify-between gap-2">
        <h2 className="text-base">A board through this look</h2>
        <label className="flex items-center gap-2 text-sm">
          Board
          <select className="rounded-md border border-paper-line bg-paper px-2 py-1 text-sm" value={boardId ?? ''} onChange={(e) => onBoard(e.target.value ? Number(e.target.value) : undefined)}>
            <option value="">none</option>
            {boards.map((b) => <option key={b.id} value={b.id}>{b.name} ({b.department})</option>)}
          </select>
        </label>
      </div>
      {chips && (
        <div className={`grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4 ${stale ? 'opacity-80' : ''}`} aria-busy={stale}>
          {sorted.map((t) => {
            const s = chips.swatches.find((x) => x.id === t.swatchId)!;
            return <SplitChip key={t.swatchId} name={s.name} hex={s.hex} tone={t} {...mergeNames(merges.get(t.swatchId), nameOf)} estimated={s.estimated} size="sm" />;
          })}
        </div>
      )}
      {boardLink && <p className="mt-2 text-xs text-ink-mute"><Link className="text-accent underline" to={boardLink}>Open the board</Link> to compare saved looks side by side.</p>}
    </>
  );
}
