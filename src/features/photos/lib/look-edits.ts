/**
 * The live preview's changes to a look — the light's colour temperature, a parametric filter's
 * wavelength — as sources the engine understands: for the browser's own table, and as an unsaved look
 * definition for a full-resolution render of exactly what is on screen.
 */
import type { LookView, LookDefinitionInput } from '../../../../shared/schemas/look';
import type { PhotoFilterEdit, PhotoLightEdit, PhotoLookView } from '../../../../shared/schemas/photo';
import type { FilterSource, LightSource } from '../../../../shared/schemas/simulate';

export interface LookEdits {
  /** the light's CCT, K (when the look's light can be retuned) */
  kelvin?: number;
  /** filter index → its moved wavelength, nm */
  filterNm?: Record<number, number>;
}

export function hasEdits(e: LookEdits): boolean {
  return e.kelvin !== undefined || Object.keys(e.filterNm ?? {}).length > 0;
}

/** The light at another CCT, same form and gels. */
export function editedLightSource(edit: PhotoLightEdit, kelvin: number): LightSource {
  const base: LightSource = edit.kind === 'blackbody' ? { blackbody: kelvin } : { daylight: kelvin };
  return edit.gels.length ? { ...base, gels: edit.gels } : base;
}

/** The parametric filter with its cut-on, cut-off or centre moved to `nm`. */
export function editedFilterSource(edit: PhotoFilterEdit, nm: number): FilterSource {
  const form = edit.source[edit.form] as Record<string, number>;
  return { ...edit.source, [edit.form]: { ...form, [edit.param]: nm } } as FilterSource;
}

/** A stable text of the edits that apply to `view` (for cache keys). */
export function editsKey(view: PhotoLookView, e: LookEdits): string {
  const k = view.light.edit && e.kelvin !== undefined && e.kelvin !== view.light.edit.kelvin ? Math.round(e.kelvin) : null;
  const f = view.filters.map((fl, i) => (fl.edit && e.filterNm?.[i] !== undefined && e.filterNm[i] !== fl.edit.nm ? Math.round(e.filterNm[i] * 10) / 10 : null));
  return `${view.contentHash}|${k}|${f.join(',')}`;
}

/** The saved look with the edits applied, as a definition the render endpoint takes. */
export function editedDefinition(look: LookView, view: PhotoLookView, e: LookEdits): LookDefinitionInput {
  const light = view.light.edit && e.kelvin !== undefined ? { source: editedLightSource(view.light.edit, e.kelvin) } : look.light;
  const filters = look.filters.map((f, i) => {
    const edit = view.filters[i]?.edit;
    const nm = e.filterNm?.[i];
    return edit && nm !== undefined ? { on: f.on, filter: { source: editedFilterSource(edit, nm) } } : f;
  });
  return { light, filters, medium: look.medium, tone: look.tone };
}
