import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { ErrorMessage, Notice } from '../../../components/ui/alert';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { usePreviewSwatchImport } from '../api/preview-swatch-import';
import { useImportSwatches } from '../api/import-swatches';

/** A board the importer may put swatches on. */
interface BoardChoice {
  id: number;
  name: string;
  department: Department;
}

interface Props {
  pid: number;
  myDepartment: Department;
  /** editors and owners may file the swatches under any department */
  anyDepartment: boolean;
  /** the boards the importer may change */
  boards: BoardChoice[];
  onImported: (swatches: SwatchView[], boardId: number | null) => void;
}

/**
 * "Import measured file": a spectrophotometer export (CGATS.17 text, Argyll .ti3 or .sp) → the server's
 * preview (names, colour chips, point counts, what the values were taken to be) → "Add N swatches".
 * Errors come from the server and name the file's line and field.
 */
export function SwatchImportForm({ pid, myDepartment, anyDepartment, boards, onImported }: Props) {
  const [file, setFile] = useState<File | null>(null);
  const [department, setDepartment] = useState<Department | ''>('');
  const [boardId, setBoardId] = useState(0);
  const preview = usePreviewSwatchImport();
  const run = useImportSwatches(pid);
  const fields = { department: department || undefined, boardId: boardId || undefined };
  const board = boards.find((b) => b.id === boardId);
  const p = preview.data?.preview;

  function choose(f: File | null, next: { department?: Department | ''; boardId?: number } = {}) {
    setFile(f);
    run.reset();
    if (!f) return preview.reset();
    const d = next.department ?? department;
    const b = next.boardId ?? boardId;
    preview.mutate({ pid, file: f, department: d || undefined, boardId: b || undefined });
  }

  return (
    <div className="grid gap-3" aria-label="Import measured file" role="group">
      <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
        Spectrophotometer file (CGATS.17 text, .ti3 or .sp; one swatch per sample)
        <input id="swatch-import-file" type="file" accept=".txt,.cgats,.cgt,.it8,.ti3,.sp,text/plain" className="text-sm normal-case"
          onChange={(e) => choose(e.target.files?.[0] ?? null)} />
      </label>
      <div className="grid gap-3">
        {anyDepartment ? (
          <SelectField label="Department" value={department} onChange={(e) => { const d = e.target.value as Department | ''; setDepartment(d); if (file) choose(file, { department: d }); }}>
            <option value="">{board ? `the board's (${board.department})` : `mine (${myDepartment})`}</option>
            {DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}
          </SelectField>
        ) : (
          <p className="text-xs text-ink-mute">Department: <strong className="text-ink">{myDepartment}</strong></p>
        )}
        <SelectField label="Put them on a board" value={boardId} onChange={(e) => { const b = Number(e.target.value); setBoardId(b); if (file) choose(file, { boardId: b }); }}>
          <option value={0}>no board</option>
          {boards.map((b) => <option key={b.id} value={b.id}>{b.name} ({b.department})</option>)}
        </SelectField>
      </div>
      <ErrorMessage error={preview.error ?? run.error} />
      {preview.isPending && <p className="text-sm text-ink-mute" role="status">Reading the file…</p>}
      {p && !run.isSuccess && (
        <>
          <Notice>
            <strong>{file?.name}</strong> ({p.fileType}): {p.count} sample{p.count === 1 ? '' : 's'}. {p.assumption}
          </Notice>
          <div className="max-h-80 overflow-auto rounded-md border border-paper-line">
            <table className="w-full text-sm" aria-label="Samples in the file">
              <thead className="sticky top-0 bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft">
                <tr><th className="px-2 py-1">Colour</th><th className="px-2 py-1">Name</th><th className="px-2 py-1">Points</th><th className="px-2 py-1">Range</th><th className="px-2 py-1">Line</th></tr>
              </thead>
              <tbody className="divide-y divide-paper-line">
                {p.samples.map((s, i) => (
                  <tr key={i}>
                    <td className="px-2 py-1"><span className="block h-5 w-8 rounded border border-paper-line" style={{ background: s.hex }} title={s.hex} aria-label={`colour ${s.hex}`} /></td>
                    <td className="px-2 py-1">{s.name}</td>
                    <td className="px-2 py-1 tabular-nums">{s.points}</td>
                    <td className="px-2 py-1 tabular-nums">{s.firstNm}–{s.lastNm} nm</td>
                    <td className="px-2 py-1 tabular-nums text-ink-mute">{s.line}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <Button variant="primary" className="self-start" disabled={run.isPending || !file}
            onClick={() => file && run.mutate({ pid, file, ...fields }, { onSuccess: (r) => onImported(r.swatches, boardId || null) })}>
            Add {p.count} swatch{p.count === 1 ? '' : 'es'}{board ? ` to ${board.name}` : ''}
          </Button>
        </>
      )}
      {run.isSuccess && (
        <Notice>Added {run.data.swatches.length} measured swatch{run.data.swatches.length === 1 ? '' : 'es'}{board ? ` to ${board.name}` : ''}.</Notice>
      )}
    </div>
  );
}
