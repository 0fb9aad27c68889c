import type { ActivityEntryView, ActivityKind } from '../../../../shared/schemas/activity';

/** How a kind is named in a sentence. */
const NOUN: Record<ActivityKind, string> = {
  production: 'the production',
  look: 'look',
  swatch: 'swatch',
  board: 'board',
  curve: 'curve',
  photo: 'photo',
  member: 'member',
  invitation: 'invitation',
};

/** The verb and object of an entry, e.g. "changed look 'Night exterior'"; detail not included. */
function head(e: ActivityEntryView): string {
  const named = `'${e.itemName}'`;
  if (e.kind === 'production') return `${e.action} the production`;
  if (e.action === 'imported') return `imported ${e.itemName}`;
  if (e.kind === 'invitation' && e.action === 'created') return `invited ${named}`;
  if (e.kind === 'invitation' && e.action === 'deleted') return `revoked the invitation of ${named}`;
  if (e.kind === 'member' && e.action === 'deleted') return `removed member ${named}`;
  if (e.kind === 'member' && e.action === 'created') return `added member ${named}`;
  return `${e.action} ${NOUN[e.kind]} ${named}`;
}

/** What an entry says happened: "changed look 'Night exterior, rain' — renamed from 'Night exterior', filters". */
export function entrySentence(e: ActivityEntryView): string {
  return e.detail ? `${head(e)} — ${e.detail}` : head(e);
}

/** A kind as a filter's choice: "looks", "swatches", "the production". */
export function kindPlural(k: ActivityKind): string {
  if (k === 'production') return NOUN.production;
  return k === 'swatch' ? 'swatches' : `${k}s`;
}
