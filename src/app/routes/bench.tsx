import { useEffect, useMemo, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { TextAreaField, TextField } from '../../components/ui/field';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useLooks } from '../../features/looks/api/get-looks';
import { useCreateLook } from '../../features/looks/api/create-look';
import { useUpdateLook } from '../../features/looks/api/update-look';
import { useDuplicateLook } from '../../features/looks/api/duplicate-look';
import { useDeleteLook } from '../../features/looks/api/delete-look';
import { useAnalyseLook } from '../../features/looks/api/analyse-look';
import { useLibrary } from '../../features/library/api/get-library';
import { useCurves } from '../../features/library/api/get-curves';
import { useBoards, boardsQueryOptions } from '../../features/boards/api/get-boards';
import { swatchesQueryOptions } from '../../features/swatches/api/get-swatches';
import { LightPathEditor } from '../../features/bench/components/light-path-editor';
import { SpectraChart } from '../../features/bench/components/spectra-chart';
import { FactorPanel } from '../../features/bench/components/factor-panel';
import { BenchExposure } from '../../features/exposure/components/bench-exposure';
import { optionsFor } from '../../features/bench/lib/look-options';
import { draftOf, newLookDraft } from '../../features/bench/lib/default-look';
import { useDebounced } from '../../features/bench/hooks/use-debounced';
import { SplitChip } from '../../features/boards/components/split-chip';
import { roleAtLeast } from '../../../shared/schemas/roles';
import type { LookDefinition } from '../../../shared/schemas/look';

const EMPTY: never[] = [];

export default function BenchPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const lookId = params.lookId && params.lookId !== 'new' ? Number(params.lookId) : 0;
  const navigate = useNavigate();
  const qc = useQueryClient();
  const prod = useProduction(pid);
  const canEdit = !!prod.data && roleAtLeast(prod.data.production.myRole, 'editor');
  const looks = useLooks(pid);
  const library = useLibrary();
  const curves = useCurves(pid);
  const boards = useBoards(pid);
  const create = useCreateLook(pid);
  const update = useUpdateLook(pid);
  const duplicate = useDuplicateLook(pid);
  const remove = useDeleteLook(pid);

  const saved = looks.data?.looks.find((l) => l.id === lookId);
  const [draft, setDraft] = useState<LookDefinition>(newLookDraft);
  const [name, setName] = useState('New look');
  const [notes, setNotes] = useState('');
  const [loadedId, setLoadedId] = useState<number | null>(null);
  const [boardId, setBoardId] = useState<number | undefined>(undefined);
  const [notice, setNotice] = useState<string | null>(null);

  useEffect(() => {
    if (lookId === 0 && loadedId !== 0) {
      setDraft(newLookDraft());
      setName('New look');
      setNotes('');
      setLoadedId(0);
    } else if (saved && loadedId !== saved.id) {
      setDraft(draftOf(saved));
      setName(saved.name);
      setNotes(saved.notes);
      setLoadedId(saved.id);
    }
  }, [lookId, saved, loadedId]);
  useEffect(() => {
    if (params.lookId === undefined && looks.data) navigate(`/p/${pid}/bench/${looks.data.looks[0]?.id ?? 'new'}`, { replace: true });
  }, [params.lookId, looks.data, navigate, pid]);
  useEffect(() => {
    if (boardId === undefined && boards.data?.boards.length) {
      const mine = boards.data.boards.find((b) => b.department === prod.data?.production.myDepartment);
      setBoardId((mine ?? boards.data.boards[0]).id);
    }
  }, [boards.data, boardId, prod.data]);

  const options = useMemo(() => {
    const lib = library.data?.items ?? EMPTY;
    const cs = curves.data?.curves ?? EMPTY;
    return { light: optionsFor('light', lib, cs), filter: optionsFor('filter', lib, cs), medium: optionsFor('medium', lib, cs) };
  }, [library.data, curves.data]);

  const settled = useDebounced(draft, 180);
  const input = useMemo(() => ({ look: settled, boardId }), [settled, boardId]);
  const analysis = useAnalyseLook(pid, input);
  const stale = analysis.isPlaceholderData || settled !== draft || analysis.isFetching;
  const dirty = saved ? JSON.stringify(draftOf(saved)) !== JSON.stringify(draft) || saved.name !== name || saved.notes !== notes : true;

  const invalidateTones = () => {
    qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey });
    qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey });
  };
  function save() {
    setNotice(null);
    if (saved) update.mutate({ pid, id: saved.id, name, notes, ...draft }, { onSuccess: () => { invalidateTones(); setNotice('Saved.'); } });
    else create.mutate({ pid, name, notes, ...draft }, { onSuccess: (r) => { invalidateTones(); navigate(`/p/${pid}/bench/${r.look.id}`); } });
  }
  function saveAsNew() {
    create.mutate({ pid, name: `${name} (new)`, notes, ...draft }, { onSuccess: (r) => navigate(`/p/${pid}/bench/${r.look.id}`) });
  }

  if (prod.isPending || looks.isPending || library.isPending) return <Spinner />;
  if (lookId && !saved) return <ErrorMessage error={looks.error ?? new Error('That look was not found.')} />;

  const chips = analysis.data?.board;
  const sortedChips = chips ? [...chips.tones.tones].sort((a, b) => b.stops - a.stops) : [];
  const mergesOf = (id: number) => (chips?.tones.merges ?? []).filter((m) => m.a === id || m.b === id).map((m) => chips!.swatches.find((s) => s.id === (m.a === id ? m.b : m.a))?.name ?? '');

  return (
    <>
      <PageHeader
        title={<>Bench <span className="text-ink-mute">·</span> {name}</>}
        subtitle="The look as its light path. Change the light, a filter or the medium: the factor and the board follow."
        actions={
          <>
            <label className="sr-only" htmlFor="bench-look">Open a look</label>
            <select id="bench-look" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm" value={lookId || 'new'}
              onChange={(e) => navigate(`/p/${pid}/bench/${e.target.value}`)}>
              {looks.data?.looks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
              {canEdit && <option value="new">New look…</option>}
            </select>
            {saved && <Link to={`/p/${pid}/looks/${saved.id}/sheet`} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">Exposure sheet</Link>}
            <Link to={`/p/${pid}/looks`} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">All looks</Link>
          </>
        }
      />
      {!canEdit && <div className="mb-4"><Notice>You can try changes here; saving looks needs the editor role.</Notice></div>}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
        <div>
          <Card className="mb-4 grid gap-3">
            <TextField label="Look name" value={name} onChange={(e) => setName(e.target.value)} disabled={!canEdit} />
            <TextAreaField label="Notes" rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} disabled={!canEdit} />
            {canEdit && (
              <div className="flex flex-wrap items-center gap-2">
                <Button variant="primary" onClick={save} disabled={create.isPending || update.isPending || !dirty}>{saved ? 'Save look' : 'Save as a look'}</Button>
                {saved && <Button onClick={saveAsNew} disabled={create.isPending}>Save as new</Button>}
                {saved && <Button onClick={() => duplicate.mutate({ pid, id: saved.id }, { onSuccess: (r) => navigate(`/p/${pid}/bench/${r.look.id}`) })}>Duplicate</Button>}
                {saved && <Button variant="danger" onClick={() => confirm(`Delete the look "${saved.name}"?`) && remove.mutate({ pid, id: saved.id }, { onSuccess: () => { invalidateTones(); navigate(`/p/${pid}/looks`); } })}>Delete</Button>}
                {notice && !dirty && <span className="text-sm text-ink-mute" role="status">{notice}</span>}
                {dirty && saved && <span className="text-xs text-ink-mute">unsaved changes</span>}
              </div>
            )}
            <ErrorMessage error={create.error ?? update.error ?? duplicate.error ?? remove.error} />
          </Card>
          <LightPathEditor draft={draft} onChange={setDraft} options={options} curves={analysis.data?.analysis.curves} readOnly={false} />
        </div>
        <div className="grid content-start gap-4">
          <ErrorMessage error={analysis.error} />
          {analysis.isPending && !analysis.data && <Spinner label="Computing…" />}
          {analysis.data && (
            <>
              <Card><FactorPanel analysis={analysis.data.analysis} stale={stale} /></Card>
              <Card><BenchExposure look={draft} analysis={analysis.data.analysis} board={analysis.data.board} onLookChange={setDraft} stale={stale} /></Card>
              <Card className={stale ? 'opacity-80' : ''}><SpectraChart analysis={analysis.data.analysis} /></Card>
            </>
          )}
          <Card>
            <div className="mb-3 flex flex-wrap items-end justify-between gap-2">
              <h2 className="text-base">A board through this look</h2>
              <label className="flex items-center gap-2 text-sm">
                Board
                <select className="rounded-md border border-paper-line bg-paper px-2 py-1 text-sm" value={boardId ?? ''} onChange={(e) => setBoardId(e.target.value ? Number(e.target.value) : undefined)}>
                  <option value="">none</option>
                  {boards.data?.boards.map((b) => <option key={b.id} value={b.id}>{b.name} ({b.department})</option>)}
                </select>
              </label>
            </div>
            {chips && (
              <div className={`grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4 ${stale ? 'opacity-80' : ''}`} aria-busy={stale}>
                {sortedChips.map((t) => {
                  const s = chips.swatches.find((x) => x.id === t.swatchId)!;
                  return <SplitChip key={t.swatchId} name={s.name} hex={s.hex} tone={t} mergesWith={mergesOf(t.swatchId)} estimated={s.estimated} size="sm" />;
                })}
              </div>
            )}
            {boardId && <p className="mt-2 text-xs text-ink-mute"><Link className="text-accent underline" to={`/p/${pid}/boards/${boardId}`}>Open the board</Link> to compare saved looks side by side.</p>}
          </Card>
        </div>
      </div>
    </>
  );
}
