import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { useSwatch } from '../../features/swatches/api/get-swatch';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { useDeleteSwatch } from '../../features/swatches/api/delete-swatch';
import { SwatchForm } from '../../features/swatches/components/swatch-form';
import { SwatchList } from '../../features/swatches/components/swatch-list';
import { SwatchDetail } from '../../features/swatches/components/swatch-detail';
import { SwatchImportForm } from '../../features/swatches/components/swatch-import-form';
import { Button } from '../../components/ui/button';
import { useBoards, boardsQueryOptions } from '../../features/boards/api/get-boards';
import { AddToBoard } from '../../features/boards/components/add-to-board';
import { mayAddItems, mayChangeDepartmentItem, roleAtLeast } from '../../../shared/policy/department';

export default function SwatchesPage() {
  const pid = Number(useParams().productionId);
  const qc = useQueryClient();
  const { member } = useMember(pid);
  const [selected, setSelected] = useState(0);
  const [importing, setImporting] = useState(false);
  const list = useSwatches(pid);
  const create = useCreateSwatch(pid);
  const remove = useDeleteSwatch(pid);
  const boards = useBoards(pid);
  const sel = useSwatch(pid, selected).data?.swatch;
  const myBoards = (boards.data?.boards ?? []).filter((b) => mayChangeDepartmentItem(member, b.department));

  return (
    <>
      <PageHeader title="Swatches" subtitle="Surfaces: lip colours, fabrics, paints. Each is measured, or estimated from its colour." />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
        <div className="min-w-0">
          {list.isPending && <Spinner />}
          <ErrorMessage error={list.error ?? remove.error} />
          <SwatchList swatches={list.data?.swatches ?? []} selected={selected} onSelect={setSelected}
            mayDelete={(s) => mayChangeDepartmentItem(member, s.department)}
            onDelete={(s) => remove.mutate({ pid, id: s.id }, { onSuccess: () => { if (selected === s.id) setSelected(0); qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }); } })} />
        </div>
        <div className="grid content-start gap-4">
          {sel && (
            <SwatchDetail pid={pid} swatch={sel}>
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
                    onImported={(added) => { qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }); if (added[0]) setSelected(added[0].id); }}
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
                pending={create.isPending}
                error={create.error}
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
