import { useState } from 'react';
import { daySheetsPdfUrl } from '../api/day-sheets-pdf';
import { MAX_DAY_SHEETS } from '../../../../shared/schemas/sheet';

/**
 * One PDF of the day's looks: choose the looks (this one to begin with), then download their sheets one
 * after another, each starting on a new page (GET …/sheets.pdf?looks=).
 */
export function DaySheetsDownload({ pid, looks, currentLookId }: { pid: number; looks: readonly { id: number; name: string }[]; currentLookId: number }) {
  const [chosen, setChosen] = useState<number[]>([currentLookId]);
  // in the order of the looks list, whatever the order of the clicks
  const ids = looks.map((l) => l.id).filter((id) => chosen.includes(id));
  const toggle = (id: number, checked: boolean) => setChosen((c) => (checked ? [...c, id] : c.filter((x) => x !== id)));
  return (
    <details className="no-print mb-4 rounded-lg border border-paper-line bg-white p-3 text-sm" data-testid="day-sheets">
      <summary className="cursor-pointer font-medium text-accent">PDF of the day’s looks…</summary>
      <fieldset className="mt-2">
        <legend className="mb-1 text-xs text-ink-mute">The looks to shoot: one sheet after another, each on a new page.</legend>
        <ul className="grid grid-cols-2 gap-x-4 gap-y-1 sm:grid-cols-3">
          {looks.map((l) => (
            <li key={l.id}>
              <label className="inline-flex items-center gap-1.5">
                <input type="checkbox" checked={chosen.includes(l.id)} onChange={(e) => toggle(l.id, e.target.checked)} />
                <span className="[font-variant-numeric:normal]">{l.name}</span>
              </label>
            </li>
          ))}
        </ul>
      </fieldset>
      <div className="mt-2 flex items-center gap-2">
        {ids.length > MAX_DAY_SHEETS ? (
          <span className="text-xs text-warn">At most {MAX_DAY_SHEETS} looks in one PDF.</span>
        ) : ids.length > 0 ? (
          <a href={daySheetsPdfUrl(pid, ids)} download className="inline-flex items-center rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-strong">
            Download {ids.length} sheet{ids.length === 1 ? '' : 's'} (PDF)
          </a>
        ) : (
          <span className="text-xs text-ink-mute">Choose at least one look.</span>
        )}
      </div>
    </details>
  );
}
