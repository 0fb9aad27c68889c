import { useEffect, useMemo, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
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
import { BenchBoard, useBenchBoardChoice } from '../../features/bench/components/bench-board';
import { LookMetaCard } from '../../features/bench/components/look-meta-card';
import { MonitorTableDownload } from '../../features/bench/components/monitor-table-download';
import { BenchExposure } from '../../features/exposure/components/bench-exposure';
import { lookOptions } from '../../features/bench/lib/look-options';
import { useLookDraft } from '../../features/bench/hooks/use-look-draft';
import { useDebounced } from '../../lib/use-debounced';
import { roleAtLeast } from '../../../shared/policy/department';
import { paths } from '../../lib/paths';

export default function BenchPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const lookId = params.lookId && params.lookId !== 'new' ? Number(params.lookId) : 0;
  const to = paths.production(pid);
  const navigate = useNavigate();
  const qc = useQueryClient();
  const { production, member } = useMember(pid);
  const canEdit = !!member && roleAtLeast(member.role, 'editor');
  const looks = useLooks(pid);
  const library = useLibrary();
  const curves = useCurves(pid);
  const boards = useBoards(pid);
  const create = useCreateLook(pid);
  const update = useUpdateLook(pid);
  const duplicate = useDuplicateLook(pid);
  const remove = useDeleteLook(pid);

  const saved = looks.data?.looks.find((l) => l.id === lookId);
  const { draft, setDraft, name, setName, notes, setNotes, dirty } = useLookDraft(lookId, saved);
  const [boardId, setBoardId] = useBenchBoardChoice(boards.data?.boards, member?.department);
  const [notice, setNotice] = useState<string | null>(null);
  useEffect(() => {
    if (params.lookId === undefined && looks.data) navigate(paths.production(pid).bench(looks.data.looks[0]?.id ?? 'new'), { replace: true });
  }, [params.lookId, looks.data, navigate, pid]);

  const options = useMemo(() => lookOptions(library.data?.items, curves.data?.curves), [library.data, curves.data]);
  const settled = useDebounced(draft, 180);
  const input = useMemo(() => ({ look: settled, boardId }), [settled, boardId]);
  const analysis = useAnalyseLook(pid, input);
  const stale = analysis.isPlaceholderData || settled !== draft || analysis.isFetching;

  const invalidateTones = () => {
    qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey });
    qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey });
  };
  const openLook = (id: number) => navigate(to.bench(id));
  function save() {
    setNotice(null);
    if (saved) update.mutate({ pid, id: saved.id, name, notes, ...draft }, { onSuccess: () => { invalidateTones(); setNotice('Saved.'); } });
    else create.mutate({ pid, name, notes, ...draft }, { onSuccess: (r) => { invalidateTones(); openLook(r.look.id); } });
  }

  if (production.isPending || looks.isPending || library.isPending) return <Spinner />;
  if (lookId && !saved) return <ErrorMessage error={looks.error ?? new Error('That look was not found.')} />;

  return (
    <>
      <PageHeader
        title={<>Bench <span className="text-ink-mute">·</span> {name}</>}
        subtitle="The look as its light path. Change the light, a filter or the medium: the factor and the board follow."
        actions={
          <>
            <label className="sr-only" htmlFor="bench-look">Open a look</label>
            <select id="bench-look" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm" value={lookId || 'new'}
              onChange={(e) => navigate(to.bench(e.target.value))}>
              {looks.data?.looks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
              {canEdit && <option value="new">New look…</option>}
            </select>
            {saved && <MonitorTableDownload pid={pid} lookId={saved.id} dirty={dirty} />}
            {saved && <Link to={to.sheet(saved.id)} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">Exposure sheet</Link>}
            <Link to={to.looks()} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">All looks</Link>
          </>
        }
      />
      {!canEdit && <div className="mb-4"><Notice>You can try changes here; saving looks needs the editor role.</Notice></div>}
      {/* side by side from laptop widths: the light path on the left, the factor and the board's tones beside it, then the exposure and the spectra */}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)] xl:grid-cols-[minmax(0,4fr)_minmax(0,7fr)]">
        <div>
          <LookMetaCard name={name} notes={notes} onName={setName} onNotes={setNotes} canEdit={canEdit} savedName={saved?.name ?? null} dirty={dirty} notice={notice}
            saving={{ save: create.isPending || update.isPending, create: create.isPending }} onSave={save}
            onSaveAsNew={() => create.mutate({ pid, name: `${name} (new)`, notes, ...draft }, { onSuccess: (r) => openLook(r.look.id) })}
            onDuplicate={() => saved && duplicate.mutate({ pid, id: saved.id }, { onSuccess: (r) => openLook(r.look.id) })}
            onDelete={() => saved && remove.mutate({ pid, id: saved.id }, { onSuccess: () => { invalidateTones(); navigate(to.looks()); } })}
            error={create.error ?? update.error ?? duplicate.error ?? remove.error} />
          <LightPathEditor draft={draft} onChange={setDraft} options={options} curves={analysis.data?.analysis.curves} readOnly={false} />
        </div>
        <div className="grid content-start gap-4">
          <ErrorMessage error={analysis.error} />
          {analysis.isPending && !analysis.data && <Spinner label="Computing…" />}
          {analysis.data && <Card><FactorPanel analysis={analysis.data.analysis} stale={stale} /></Card>}
          <Card>
            <BenchBoard boards={boards.data?.boards ?? []} boardId={boardId} onBoard={setBoardId} chips={analysis.data?.board} stale={stale} boardLink={boardId ? to.board(boardId) : null} />
          </Card>
          {analysis.data && (
            <>
              <Card><BenchExposure look={draft} analysis={analysis.data.analysis} board={analysis.data.board} onLookChange={setDraft} stale={stale} /></Card>
              <Card className={stale ? 'opacity-80' : ''}><SpectraChart analysis={analysis.data.analysis} /></Card>
            </>
          )}
        </div>
      </div>
    </>
  );
}
