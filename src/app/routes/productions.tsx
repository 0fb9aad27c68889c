import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { TextField, TextAreaField } from '../../components/ui/field';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useProductions } from '../../features/productions/api/get-productions';
import { useCreateProduction } from '../../features/productions/api/create-production';
import { productionCreateSchema } from '../../../shared/schemas/auth';
import { zodFieldErrors } from '../../lib/form-errors';
import { paths } from '../../lib/paths';

export default function ProductionsPage() {
  const list = useProductions();
  const create = useCreateProduction();
  const navigate = useNavigate();
  const [open, setOpen] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = productionCreateSchema.safeParse(Object.fromEntries(new FormData(e.currentTarget)));
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (r) => navigate(paths.production(r.production.id).root()) });
  }

  return (
    <>
      <PageHeader
        title="Productions"
        subtitle="Each film or series keeps its own looks, library, boards and team."
        actions={<Button variant="primary" onClick={() => setOpen((o) => !o)}>New production</Button>}
      />
      {open && (
        <Card className="mb-6 max-w-xl">
          <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
            <TextField label="Name" name="name" error={errors.name} autoFocus />
            <TextAreaField label="Description" name="description" rows={3} error={errors.description} />
            <ErrorMessage error={create.error} />
            <div className="flex gap-2">
              <Button type="submit" variant="primary" disabled={create.isPending}>Create</Button>
              <Button variant="ghost" onClick={() => setOpen(false)}>Cancel</Button>
            </div>
          </form>
        </Card>
      )}
      {list.isPending && <Spinner />}
      <ErrorMessage error={list.error} />
      {list.data && list.data.productions.length === 0 && (
        <p className="text-ink-soft">You are not a member of any production yet. Create one, or ask an owner for an invitation.</p>
      )}
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {list.data?.productions.map((p) => (
          <li key={p.id}>
            <Link to={paths.production(p.id).root()} className="block h-full rounded-lg border border-paper-line bg-paper-raised p-4 hover:border-accent">
              <div className="flex items-start justify-between gap-2">
                <h2>{p.name}</h2>
                {p.isDemo && <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-[10px] uppercase tracking-wide text-ink-mute">invented demo</span>}
              </div>
              <p className="mt-1 line-clamp-3 text-sm text-ink-soft">{p.description}</p>
              <p className="mt-3 text-xs text-ink-mute">You: {p.myRole} · {p.myDepartment}</p>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
