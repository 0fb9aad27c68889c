import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { SelectField, TextField } from '../../components/ui/field';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useBoards } from '../../features/boards/api/get-boards';
import { useCreateBoard } from '../../features/boards/api/create-board';
import { useDeleteBoard } from '../../features/boards/api/delete-board';
import { useLooks } from '../../features/looks/api/get-looks';
import { useSwatches } from '../../features/swatches/api/get-swatches';
import { DEPARTMENTS, roleAtLeast, type Department } from '../../../shared/schemas/roles';
import { boardCreateSchema, MAX_BOARD_LOOKS } from '../../../shared/schemas/board';
import { apiFieldError, zodFieldErrors } from '../../lib/form-errors';

export default function BoardsPage() {
  const pid = Number(useParams().productionId);
  const navigate = useNavigate();
  const prod = useProduction(pid);
  const me = prod.data?.production;
  const boards = useBoards(pid);
  const looks = useLooks(pid);
  const swatches = useSwatches(pid);
  const create = useCreateBoard(pid);
  const remove = useDeleteBoard(pid);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const canAdd = !!me && roleAtLeast(me.myRole, 'contributor');
  const canAll = !!me && roleAtLeast(me.myRole, 'editor');
  const mayEdit = (d: Department) => canAll || (me?.myRole === 'contributor' && me.myDepartment === d);

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const department = ((f.get('department') as Department) || me!.myDepartment) as Department;
    const input = {
      name: String(f.get('name') ?? ''),
      department,
      lookIds: (looks.data?.looks ?? []).slice(0, MAX_BOARD_LOOKS).map((l) => l.id),
      swatchIds: f.get('withSwatches') ? (swatches.data?.swatches ?? []).filter((s) => s.department === department).map((s) => s.id) : [],
    };
    const parsed = boardCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    create.mutate({ pid, ...input }, { onSuccess: (r) => navigate(`/p/${pid}/boards/${r.board.id}`), onError: (err) => setErrors(apiFieldError(err)) });
  }

  return (
    <>
      <PageHeader title="Boards" subtitle="Each department's swatches seen through the looks: tones, zones, shifts and merges." />
      {boards.isPending && <Spinner />}
      <ErrorMessage error={boards.error ?? remove.error} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="grid content-start gap-3 sm:grid-cols-2">
          {boards.data?.boards.map((b) => (
            <Card key={b.id} className="hover:border-accent">
              <p className="text-[10px] font-semibold uppercase tracking-widest text-ink-mute">{b.department}</p>
              <h2><Link to={`/p/${pid}/boards/${b.id}`} className="hover:text-accent">{b.name}</Link></h2>
              <p className="mt-1 text-sm text-ink-soft">{b.swatchIds.length} swatches · {b.lookIds.length} look{b.lookIds.length === 1 ? '' : 's'}</p>
              <div className="mt-1 flex flex-wrap gap-0.5" aria-hidden="true">
                {b.swatchIds.slice(0, 16).map((id) => <span key={id} className="h-3 w-3 rounded-sm border border-paper-line" style={{ background: swatches.data?.swatches.find((s) => s.id === id)?.hex }} />)}
              </div>
              {mayEdit(b.department) && (
                <Button variant="ghost" className="mt-2" onClick={() => confirm(`Delete the board "${b.name}"? Its swatches stay.`) && remove.mutate({ pid, id: b.id })}>Delete</Button>
              )}
            </Card>
          ))}
        </div>
        {canAdd ? (
          <Card>
            <h2 className="mb-3">New board</h2>
            <form onSubmit={submit} className="grid gap-3" noValidate aria-label="New board">
              <TextField label="Name" name="name" error={errors.name} placeholder="e.g. Night-exterior wardrobe" />
              {canAll ? (
                <SelectField label="Department" name="department" defaultValue={me!.myDepartment}>{DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}</SelectField>
              ) : <p className="text-xs text-ink-mute">Department: <strong className="text-ink">{me!.myDepartment}</strong></p>}
              <label className="flex items-center gap-2 text-sm"><input type="checkbox" name="withSwatches" defaultChecked /> Start with every swatch of the department</label>
              <p className="text-xs text-ink-mute">It is seen through the first {MAX_BOARD_LOOKS} looks; change them on the board.</p>
              <ErrorMessage error={!Object.keys(errors).length && create.error} />
              <Button type="submit" variant="primary" disabled={create.isPending} className="self-start">Create board</Button>
            </form>
          </Card>
        ) : <Notice>Viewers read boards; contributors make them for their own department.</Notice>}
      </div>
    </>
  );
}
