import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ErrorMessage } from '../../../components/ui/alert';
import { TextAreaField, TextField } from '../../../components/ui/field';

/** The look's name and notes, and (for editors) saving it, saving a copy, duplicating and deleting. */
export function LookMetaCard({ name, notes, onName, onNotes, canEdit, savedName, dirty, notice, saving, onSave, onSaveAsNew, onDuplicate, onDelete, error }: {
  name: string;
  notes: string;
  onName: (v: string) => void;
  onNotes: (v: string) => void;
  canEdit: boolean;
  /** the saved look's name, or null for a new look */
  savedName: string | null;
  dirty: boolean;
  notice: string | null;
  saving: { save: boolean; create: boolean };
  onSave: () => void;
  onSaveAsNew: () => void;
  onDuplicate: () => void;
  onDelete: () => void;
  error: unknown;
}) {
  const saved = savedName !== null;
  return (
    <Card className="mb-4 grid gap-3">
      <TextField label="Look name" value={name} onChange={(e) => onName(e.target.value)} disabled={!canEdit} />
      <TextAreaField label="Notes" rows={2} value={notes} onChange={(e) => onNotes(e.target.value)} disabled={!canEdit} />
      {canEdit && (
        <div className="flex flex-wrap items-center gap-2">
          <Button variant="primary" onClick={onSave} disabled={saving.save || !dirty}>{saved ? 'Save look' : 'Save as a look'}</Button>
          {saved && <Button onClick={onSaveAsNew} disabled={saving.create}>Save as new</Button>}
          {saved && <Button onClick={onDuplicate}>Duplicate</Button>}
          {saved && <Button variant="danger" onClick={() => confirm(`Delete the look "${savedName}"?`) && onDelete()}>Delete</Button>}
          {notice && !dirty && <span className="text-sm text-ink-mute" role="status">{notice}</span>}
          {dirty && saved && <span className="text-xs text-ink-mute">unsaved changes</span>}
        </div>
      )}
      <ErrorMessage error={error} />
    </Card>
  );
}
