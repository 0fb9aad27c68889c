import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import { boardCreateSchema, MAX_BOARD_LOOKS, type BoardCreateInput } from '../../../../shared/schemas/board';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { apiFieldError, zodFieldErrors } from '../../../lib/form-errors';

/**
 * A new board: its name and department (contributors' go to their own), seen through the first looks,
 * optionally starting with every swatch of the department.
 */
export function NewBoardForm({ myDepartment, anyDepartment, lookIds, swatches, pending, error, onSubmit }: {
  myDepartment: Department;
  anyDepartment: boolean;
  lookIds: number[];
  swatches: Pick<SwatchView, 'id' | 'department'>[];
  pending: boolean;
  error: unknown;
  onSubmit: (input: BoardCreateInput, onError: (err: unknown) => void) => void;
}) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const department = ((f.get('department') as Department) || myDepartment) as Department;
    const input = {
      name: String(f.get('name') ?? ''),
      department,
      lookIds: lookIds.slice(0, MAX_BOARD_LOOKS),
      swatchIds: f.get('withSwatches') ? swatches.filter((s) => s.department === department).map((s) => s.id) : [],
    };
    const parsed = boardCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    onSubmit(input, (err) => setErrors(apiFieldError(err)));
  }
  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="New board">
      <TextField label="Name" name="name" error={errors.name} placeholder="e.g. Night-exterior wardrobe" />
      {anyDepartment ? (
        <SelectField label="Department" name="department" defaultValue={myDepartment}>{DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}</SelectField>
      ) : <p className="text-xs text-ink-mute">Department: <strong className="text-ink">{myDepartment}</strong></p>}
      <label className="flex items-center gap-2 text-sm"><input type="checkbox" name="withSwatches" defaultChecked /> Start with every swatch of the department</label>
      <p className="text-xs text-ink-mute">It is seen through the first {MAX_BOARD_LOOKS} looks; change them on the board.</p>
      <ErrorMessage error={!Object.keys(errors).length && error} />
      <Button type="submit" variant="primary" disabled={pending} className="self-start">Create board</Button>
    </form>
  );
}
