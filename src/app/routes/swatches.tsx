import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { useSwatch } from '../../features/swatches/api/get-swatch';
import { useSwatchTones } from '../../features/swatches/api/get-swatch-tones';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { useDeleteSwatch } from '../../features/swatches/api/delete-swatch';
import { SwatchForm } from '../../features/swatches/components/swatch-form';
import { SpectrumLine } from '../../features/swatches/components/spectrum-line';
import { useBoards, boardsQueryOptions } from '../../features/boards/api/get-boards';
import { useUpdateBoard } from '../../features/boards/api/update-board';
import { SplitChip } from '../../features/boards/components/split-chip';
import { DEPARTMENTS, roleAtLeast, type Department } from '../../../shared/schemas/roles';
import type { SwatchView } from '../../../shared/schemas/swatch';

function SpectrumBadge({ s }: { s: Pick<SwatchView, 'spectrum'> }) {
  return s.spectrum === 'measured'
    ? <span className="rounded bg-accent-soft px-1.5 py-0.5 text-[11px] text-accent-strong">measured</span>
    : <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-[11px] text-ink-mute">estimated spectrum</span>;
}

export default function SwatchesPage() {
  const pid = Number(useParams().productionId);
  const qc = useQueryClient();
  const prod = useProduction(pid);
  const me = prod.data?.production;
  const canEditAll = !!me && roleAtLeast(me.myRole, 'editor');
  const canAdd = !!me && roleAtLeast(me.myRole, 'contributor');
  const mayEdit = (d: Department) => canEditAll || (me?.myRole === 'contributor' && me.myDepartment === d);
  const [dept, setDept] = useState<Department | ''>('');
  const [selected, setSelected] = useState(0);
  const [notice, setNotice] = useState<{ text: string; boardId: number } | null>(null);
  const [boardPick, setBoardPick] = useState(0);
  const list = useSwatches(pid);
  const create = useCreateSwatch(pid);
  const remove = useDeleteSwatch(pid);
  const boards = useBoards(pid);
  const updateBoard = useUpdateBoard(pid);
  const detail = useSwatch(pid, selected);
  const tones = useSwatchTones(pid, selected);
  const shown = (list.data?.swatches ?? []).filter((s) => !dept || s.department === dept);
  const sel = detail.data?.swatch;
  const myBoards = (boards.data?.boards ?? []).filter((b) => sel && mayEdit(b.department));

  return (
    <>
      <PageHeader title="Swatches" subtitle="Surfaces: lip colours, fabrics, paints. Each is measured, or estimated from its colour." />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
        <div className="min-w-0">
          <div className="mb-3 flex items-center gap-2 text-sm">
            <label htmlFor="dept-filter">Department</label>
            <select id="dept-filter" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={dept} onChange={(e) => setDept(e.target.value as Department | '')}>
              <option value="">all</option>
              {DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}
            </select>
            <span className="text-ink-mute">{shown.length} swatches</span>
          </div>
          {list.isPending && <Spinner />}
          <ErrorMessage error={list.error ?? remove.error} />
          <Card className="p-0">
            <ul className="divide-y divide-paper-line" aria-label="Swatches">
              {shown.map((s) => (
                <li key={s.id} className={`flex items-center gap-3 px-3 py-2 ${selected === s.id ? 'bg-accent-soft/60' : ''}`}>
                  <span className="h-7 w-10 shrink-0 rounded border border-paper-line" style={{ background: s.hex }} aria-hidden="true" />
                  <button type="button" className="min-w-0 flex-1 truncate text-left text-sm font-medium hover:text-accent" onClick={() => setSelected(s.id)} aria-pressed={selected === s.id}>
                    {s.name}
                  </button>
                  <span className="text-xs text-ink-mute">{s.department}</span>
                  <SpectrumBadge s={s} />
                  {mayEdit(s.department) && (
                    <Button variant="ghost" aria-label={`Delete ${s.name}`} onClick={() => confirm(`Delete the swatch "${s.name}"?`) && remove.mutate({ pid, id: s.id }, { onSuccess: () => { if (selected === s.id) setSelected(0); qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }); } })}>✕</Button>
                  )}
                </li>
              ))}
            </ul>
          </Card>
        </div>
        <div className="grid content-start gap-4">
          {sel && (
            <Card aria-label={`Swatch ${sel.name}`}>
              <div className="mb-2 flex items-start justify-between gap-2">
                <div>
                  <h2>{sel.name}</h2>
                  <p className="text-xs text-ink-mute">{sel.department} · {sel.hex} · <SpectrumBadge s={sel} /></p>
                  {sel.notes && <p className="mt-1 text-sm text-ink-soft">{sel.notes}</p>}
                </div>
                <span className="h-12 w-12 shrink-0 rounded border border-paper-line" style={{ background: sel.hex }} aria-hidden="true" />
              </div>
              {sel.reflectance && <SpectrumLine pairs={sel.reflectance} max={1} width={320} label={`${sel.spectrum} reflectance of ${sel.name}`} />}
              <p className="mt-1 text-xs text-ink-mute">{sel.spectrum === 'measured' ? 'Measured reflectance, 380–780 nm.' : 'Estimated reflectance: a smooth spectrum that gives this colour in daylight (D65). A measurement would be better.'}</p>
              <h3 className="mb-2 mt-4 text-sm font-semibold">Through each look</h3>
              {tones.isPending && <Spinner label="Computing…" />}
              <div className="grid grid-cols-2 gap-2">
                {tones.data?.looks.map((l) => {
                  const t = l.tones[0];
                  return (
                    <div key={l.lookId} data-testid="swatch-look-tone">
                      <p className="mb-1 truncate text-xs font-medium" title={l.lookName}>{l.lookName}</p>
                      <SplitChip name={`zone ${t.numeral}`} hex={sel.hex} tone={t} size="sm" />
                    </div>
                  );
                })}
              </div>
              {myBoards.length > 0 && (
                <div className="mt-4 flex flex-wrap items-center gap-2 text-sm">
                  <label htmlFor="add-to-board">Put on board</label>
                  <select id="add-to-board" className="rounded-md border border-paper-line bg-paper px-2 py-1" value={boardPick} onChange={(e) => setBoardPick(Number(e.target.value))}>
                    <option value={0} disabled>choose…</option>
                    {myBoards.map((b) => <option key={b.id} value={b.id} disabled={b.swatchIds.includes(sel.id)}>{b.name}{b.swatchIds.includes(sel.id) ? ' (on it)' : ''}</option>)}
                  </select>
                  <Button disabled={!boardPick} onClick={() => {
                    const b = myBoards.find((x) => x.id === boardPick);
                    if (b) updateBoard.mutate({ pid, id: b.id, swatchIds: [...b.swatchIds, sel.id] }, { onSuccess: () => { setNotice({ text: `Now on “${b.name}”.`, boardId: b.id }); setBoardPick(0); } });
                  }}>Add</Button>
                  {notice && <span role="status" className="text-ink-mute">{notice.text} <Link className="text-accent underline" to={`/p/${pid}/boards/${notice.boardId}`}>Open the board</Link></span>}
                  <ErrorMessage error={updateBoard.error} />
                </div>
              )}
            </Card>
          )}
          {canAdd ? (
            <Card>
              <h2 className="mb-3">Add a swatch</h2>
              <SwatchForm
                myDepartment={me!.myDepartment}
                anyDepartment={canEditAll}
                pending={create.isPending}
                error={create.error}
                onSubmit={(input, reset) => create.mutate({ pid, ...input }, { onSuccess: (r) => { reset(); setSelected(r.swatch.id); setNotice(null); } })}
              />
            </Card>
          ) : (
            <Notice>Viewers read swatches; contributors add them for their own department.</Notice>
          )}
        </div>
      </div>
    </>
  );
}
