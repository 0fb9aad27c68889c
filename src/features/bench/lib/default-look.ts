import { toneSettingsSchema } from '../../../../shared/schemas/exposure';
import type { LookDefinition, LookView } from '../../../../shared/schemas/look';

/** A fresh look on the bench: studio tungsten on the panchromatic negative, no filter. */
export function newLookDraft(): LookDefinition {
  return { light: { source: { id: 'tungsten-3200' } }, filters: [], medium: { source: { id: 'panchromatic' } }, tone: toneSettingsSchema.parse({}) };
}

/** The editable part of a saved look. */
export function draftOf(l: LookView): LookDefinition {
  return { light: l.light, filters: l.filters, medium: l.medium, tone: l.tone };
}
