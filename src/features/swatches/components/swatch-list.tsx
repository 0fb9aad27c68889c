import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { SpectrumBadge } from './spectrum-badge';

/** The production's swatches, filtered by department; one is selected; deletable where `mayDelete` says so. */
export function SwatchList({ swatches, selected, onSelect, mayDelete, onDelete }: {
  swatches: SwatchView[];
  selected: number;
  onSelect: (id: number) => void;
  mayDelete: (s: SwatchView) => boolean;
  onDelete: (s: SwatchView) => void;
}) {
  const [dept, setDept] = useState<Department | ''>('');
  const shown = swatches.filter((s) => !dept || s.department === dept);
  return (
    <>
      <div className="mb-3 flex items-center gap-2 text-sm">
        <label htmlFor="dept-filter">Department</label>
        <select id="dept-filter" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={dept} onChange={(e) => setDept(e.target.value as Department | '')}>
          <option value="">all</option>
          {DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}
        </select>
        <span className="text-ink-mute">{shown.length} swatches</span>
      </div>
      <Card className="p-0">
        <ul className="divide-y divide-paper-line" aria-label="Swatches">
          {shown.map((s) => (
            <li key={s.id} className={`flex items-center gap-3 px-3 py-2 ${selected === s.id ? 'bg-accent-soft/60' : ''}`}>
              <span className="h-7 w-10 shrink-0 rounded border border-paper-line" style={{ background: s.hex }} aria-hidden="true" />
              <button type="button" className="min-w-0 flex-1 truncate text-left text-sm font-medium hover:text-accent" onClick={() => onSelect(s.id)} aria-pressed={selected === s.id}>
                {s.name}
              </button>
              <span className="text-xs text-ink-mute">{s.department}</span>
              <SpectrumBadge s={s} />
              {mayDelete(s) && (
                <Button variant="ghost" aria-label={`Delete ${s.name}`} onClick={() => confirm(`Delete the swatch "${s.name}"?`) && onDelete(s)}>✕</Button>
              )}
            </li>
          ))}
        </ul>
      </Card>
    </>
  );
}
