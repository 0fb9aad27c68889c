import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { ErrorMessage, Notice } from '../../../components/ui/alert';
import { useUpdateProduction } from '../api/update-production';
import { useDeleteProduction } from '../api/delete-production';
import { productionUpdateSchema } from '../../../../shared/schemas/auth';
import { zodFieldErrors } from '../../../lib/form-errors';
import type { ProductionSummary } from '../api/types';
import { useQueryClient } from '@tanstack/react-query';
import { productionQueryOptions } from '../api/get-production';
import { paths } from '../../../lib/paths';

/** Owner-only: rename, describe or delete the production. */
export function ProductionSettings({ production }: { production: ProductionSummary }) {
  const update = useUpdateProduction();
  const del = useDeleteProduction();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = productionUpdateSchema.safeParse(Object.fromEntries(new FormData(e.currentTarget)));
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    update.mutate({ id: production.id, ...parsed.data }, {
      onSuccess: () => {
        setSaved(true);
        qc.invalidateQueries({ queryKey: productionQueryOptions(production.id).queryKey });
      },
    });
  }
  return (
    <Card className="max-w-2xl">
      <h2 className="mb-3">Production settings</h2>
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate onChange={() => setSaved(false)}>
        <TextField label="Name" name="name" defaultValue={production.name} error={errors.name} />
        <TextAreaField label="Description" name="description" rows={3} defaultValue={production.description} error={errors.description} />
        <ErrorMessage error={update.error ?? del.error} />
        {saved && <Notice>Saved.</Notice>}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="primary" disabled={update.isPending}>Save</Button>
          <Button
            variant="danger"
            onClick={() => {
              if (confirm(`Delete "${production.name}" with all its looks, boards and photos? This cannot be undone.`))
                del.mutate(production.id, { onSuccess: () => navigate(paths.home()) });
            }}
          >
            Delete production
          </Button>
        </div>
      </form>
    </Card>
  );
}
