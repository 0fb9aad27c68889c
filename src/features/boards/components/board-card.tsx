import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import type { BoardView } from '../../../../shared/schemas/board';

/** A board in the list: its department, name, counts and the first swatches' colours. */
export function BoardCard({ board: b, to, hexOf, onDelete }: { board: BoardView; to: string; hexOf: (swatchId: number) => string | undefined; onDelete?: () => void }) {
  return (
    <Card className="hover:border-accent">
      <p className="text-[10px] font-semibold uppercase tracking-widest text-ink-mute">{b.department}</p>
      <h2><Link to={to} className="hover:text-accent">{b.name}</Link></h2>
      <p className="mt-1 text-sm text-ink-soft">{b.swatchIds.length} swatches · {b.lookIds.length} look{b.lookIds.length === 1 ? '' : 's'}</p>
      <div className="mt-1 flex flex-wrap gap-0.5" aria-hidden="true">
        {b.swatchIds.slice(0, 16).map((id) => <span key={id} className="h-3 w-3 rounded-sm border border-paper-line" style={{ background: hexOf(id) }} />)}
      </div>
      {onDelete && (
        <Button variant="ghost" className="mt-2" onClick={() => confirm(`Delete the board "${b.name}"? Its swatches stay.`) && onDelete()}>Delete</Button>
      )}
    </Card>
  );
}
