import { useEffect, useState } from 'react';
import type { LookDefinition, LookView } from '../../../../shared/schemas/look';
import { draftOf, newLookDraft } from '../lib/default-look';

/**
 * The look being edited on the bench: a fresh draft for `lookId` 0, else the saved look once it has loaded
 * (and again when another look is opened); `dirty` when it differs from what is saved.
 */
export function useLookDraft(lookId: number, saved: LookView | undefined) {
  const [draft, setDraft] = useState<LookDefinition>(newLookDraft);
  const [name, setName] = useState('New look');
  const [notes, setNotes] = useState('');
  const [loadedId, setLoadedId] = useState<number | null>(null);
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
  const dirty = saved ? JSON.stringify(draftOf(saved)) !== JSON.stringify(draft) || saved.name !== name || saved.notes !== notes : true;
  return { draft, setDraft, name, setName, notes, setNotes, dirty };
}
