import { useMemo, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { useSwatch } from '../../features/swatches/api/get-swatch';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { useDeleteSwatch } from '../../features/swatches/api/delete-swatch';
import { useUpdateSwatch } from '../../features/swatches/api/update-swatch';
import { useDuplicateSwatch } from '../../features/swatches/api/duplicate-swatch';
import { SwatchForm } from '../../features/swatches/components/swatch-form';
import { SwatchList } from '../../features/swatches/components/swatch-list';
import { SwatchDetail } from '../../features/swatches/components/swatch-detail';
import { SwatchImportForm } from '../../features/swatches/components/swatch-import-form';
import { Button } from '../../components/ui/button';
import { useBoards, boardsQueryOptions } from '../../features/boards/api/get-boards';
import { updateBoard } from '../../features/boards/api/update-board';
import { AddToBoard } from '../../features/boards/components/add-to-board';
import { useLooks } from '../../features/looks/api/get-looks';
import { useCurves } from '../../features/library/api/get-curves';
import { LiveZones } from '../../features/shade/components/live-zones';
import { ShadeFinder, type ShadeOrigin } from '../../features/shade/components/shade-finder';
import { sourcedLooks } from '../../lib/look-sources';
import { paths } from '../../lib/paths';
import type { SwatchCreateInput, SwatchView } from '../../../shared/schemas/swatch';
import { mayAddItems, mayChangeDepartmentItem, roleAtLeast } from '../../../shared/policy/department';

export default function SwatchesPage() {
  const pid = Number(useParams().productionId);
  const qc = useQueryClient();
  const { member } = useMember(pid);
  const [search, setSearch] = useSearchParams();
  const selected = Number(search.get('swatch') ?? 0) || 0;
  const setSelected = (id: number) => setSearch((q) => { const n = new URLSearchParams(q); if (id) n.set('swatch', String(id)); else n.delete('swatch'); return n; }, { replace: false });
  const [importing, setImporting] = useState(false);
  const [editing, setEditing] = useState(0);
  const list = useSwatches(pid);
  const create = useCreateSwatch(pid);
  const remove = useDeleteSwatch(pid);
  const update = useUpdateSwatch(pid);
  const duplicate = useDuplicateSwatch(pid);
  const boards = useBoards(pid);
  const looks = useLooks(pid);
  const curves = useCurves(pid);
  const sel = useSwatch(pid, selected).data?.swatch;
  const all = useMemo(() => list.data?.swatches ?? [], [list.data]);
  const myBoards = (boards.data?.boards ?? []).filter((b) => mayChangeDepartmentItem(member, b.department));
  const sourced = useMemo(() => sourcedLooks(looks.data?.looks ?? [], curves.data?.curves ?? [], all), [looks.data, curves.data, all]);
  const preview = (surface: Parameters<typeof LiveZones>[0]['surface']) => <LiveZones looks={sourced} surface={surface} caption="Zone through the production’s looks, live" />;
  const refreshBoards = () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey });

  /** A kept shade: a new swatch in the original's department, put on the boards the original is on (those I may change). */
  async function keep(from: SwatchView, name: string, origin: ShadeOrigin) {
    const input = { name, department: from.department, notes: `The shade of ${from.name} found for a zone.`, origin, lightStops: from.lightStops ?? 0 } as SwatchCreateInput;
    const { swatch } = await create.mutateAsync({ pid, ...input });
    const on = myBoards.filter((b) => b.swatchIds.includes(from.id));
    for (const b of on) await updateBoard({ pid, id: b.id, swatchIds: [...b.swatchIds, swatch.id] });
    await refreshBoards();
    return { id: swatch.id, name: swatch.name, boards: on.map((b) => ({ id: b.id, name: b.name, href: paths.production(pid).board(b.id) })) };
  }

  return (
    <>
      <PageHeader title="Swatches" subtitle="Surfaces: lip colours, skin, fabrics, paints. Each is measured, modelled from physics, or estimated from its colour." />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
        <div className="min-w-0">
          {list.isPending && <Spinner />}
          <ErrorMessage error={list.error ?? remove.error} />
          <SwatchList swatches={all} selected={selected} onSelect={(id) => { setSelected(id); setEditing(0); }}
            mayDelete={(s) => mayChangeDepartmentItem(member, s.department)}
            onDelete={(s) => remove.mutate({ pid, id: s.id }, { onSuccess: () => { if (selected === s.id) setSelected(0); refreshBoards(); } })} />
        </div>
        <div className="grid min-w-0 content-start gap-4">
          {sel && editing === sel.id && member ? (
            <Card aria-label={`Editing ${sel.name}`}>
              <h2 className="mb-3">Edit {sel.name}</h2>
              <SwatchForm key={sel.id} initial={sel} swatches={all} myDepartment={member.department} anyDepartment={roleAtLeast(member.role, 'editor')}
                pending={update.isPending} error={update.error} preview={preview} onCancel={() => setEditing(0)}
                onSubmit={(input, reset) => update.mutate({ pid, id: sel.id, ...input }, { onSuccess: () => { reset(); setEditing(0); refreshBoards(); } })} />
            </Card>
          ) : sel && (
            <SwatchDetail pid={pid} swatch={sel}
              mayChange={mayChangeDepartmentItem(member, sel.department)} mayDuplicate={mayChangeDepartmentItem(member, sel.department)}
              onEdit={() => { update.reset(); setEditing(sel.id); }}
              duplicating={duplicate.isPending}
              onDuplicate={() => duplicate.mutate({ pid, id: sel.id }, { onSuccess: (r) => { setSelected(r.swatch.id); setEditing(r.swatch.id); } })}>
              <ErrorMessage error={duplicate.error} />
              {sourced.length > 0 && (
                <div className="mt-4">
                  <ShadeFinder key={sel.id} swatches={[sel]} swatchId={sel.id} looks={sourced}
                    mayKeep={mayChangeDepartmentItem(member, sel.department)} mayReplace={(s) => mayChangeDepartmentItem(member, s.department)}
                    onKeep={keep}
                    onReplace={(s, origin) => update.mutateAsync({ pid, id: s.id, origin: origin as SwatchCreateInput['origin'] }).then(refreshBoards)} />
                </div>
              )}
              <AddToBoard key={sel.id} pid={pid} swatchId={sel.id} boards={myBoards} />
            </SwatchDetail>
          )}
          {member && mayAddItems(member) && (
            <Card>
              <div className="flex items-center justify-between gap-2">
                <h2>Import measured file</h2>
                <Button aria-expanded={importing} onClick={() => setImporting((v) => !v)}>{importing ? 'Close' : 'Import measured file'}</Button>
              </div>
              {importing && (
                <div className="mt-3">
                  <SwatchImportForm
                    pid={pid}
                    myDepartment={member.department}
                    anyDepartment={roleAtLeast(member.role, 'editor')}
                    boards={myBoards}
                    onImported={(added) => { refreshBoards(); if (added[0]) setSelected(added[0].id); }}
                  />
                </div>
              )}
            </Card>
          )}
          {member && mayAddItems(member) ? (
            <Card>
              <h2 className="mb-3">Add a swatch</h2>
              <SwatchForm
                myDepartment={member.department}
                anyDepartment={roleAtLeast(member.role, 'editor')}
                swatches={all}
                pending={create.isPending}
                error={create.error}
                preview={preview}
                onSubmit={(input, reset) => create.mutate({ pid, ...input }, { onSuccess: (r) => { reset(); setSelected(r.swatch.id); } })}
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
