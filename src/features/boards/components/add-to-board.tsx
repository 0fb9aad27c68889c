import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import type { BoardView } from '../../../../shared/schemas/board';
import { paths } from '../../../lib/paths';
import { useUpdateBoard } from '../api/update-board';

/** Puts a swatch on one of `boards` (those the member may change), then links to that board. */
export function AddToBoard({ pid, swatchId, boards }: { pid: number; swatchId: number; boards: BoardView[] }) {
  const update = useUpdateBoard(pid);
  const [pick, setPick] = useState(0);
  const [notice, setNotice] = useState<{ text: string; boardId: number } | null>(null);
  if (!boards.length) return null;
  return (
    <div className="mt-4 flex flex-wrap items-center gap-2 text-sm">
      <label htmlFor="add-to-board">Put on board</label>
      <select id="add-to-board" className="rounded-md border border-paper-line bg-paper px-2 py-1" value={pick} onChange={(e) => setPick(Number(e.target.value))}>
        <option value={0} disabled>choose…</option>
        {boards.map((b) => <option key={b.id} value={b.id} disabled={b.swatchIds.includes(swatchId)}>{b.name}{b.swatchIds.includes(swatchId) ? ' (on it)' : ''}</option>)}
      </select>
      <Button disabled={!pick} onClick={() => {
        const b = boards.find((x) => x.id === pick);
        if (b) update.mutate({ pid, id: b.id, swatchIds: [...b.swatchIds, swatchId] }, { onSuccess: () => { setNotice({ text: `Now on “${b.name}”.`, boardId: b.id }); setPick(0); } });
      }}>Add</Button>
      {notice && <span role="status" className="text-ink-mute">{notice.text} <Link className="text-accent underline" to={paths.production(pid).board(notice.boardId)}>Open the board</Link></span>}
      <ErrorMessage error={update.error} />
    </div>
  );
}
