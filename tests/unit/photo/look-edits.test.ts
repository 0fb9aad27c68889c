import { describe, expect, it } from 'vitest';
import { editedDefinition, editedFilterSource, editedLightSource, editsKey, hasEdits } from '../../../src/features/photos/lib/look-edits';
import type { LookView } from '../../../shared/schemas/look';
import type { PhotoLookView } from '../../../shared/schemas/photo';
import { lookDefinitionSchema } from '../../../shared/schemas/look';

/** A look as the API gives it (a tungsten lamp, a red long-pass on the lens, a gel on the light). */
const look = {
  id: 1,
  name: 'Test',
  notes: '',
  light: { source: { id: 'tungsten-3200' } },
  filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }, { filter: { source: { neutralDensity: 0.3 } }, on: 'light' }],
  medium: { source: { id: 'panchromatic' } },
  tone: lookDefinitionSchema.parse({ light: { source: { id: 'd65' } }, medium: { source: { id: 'eye' } } }).tone,
  createdBy: null,
  createdAt: '',
  updatedAt: '',
} as LookView;
const view = {
  contentHash: 'abc',
  light: { label: '', values: [], edit: { kind: 'blackbody', kelvin: 3200, minKelvin: 1500, maxKelvin: 12000, gels: [] } },
  filters: [
    { label: '', on: 'lens', values: [], edit: { source: { longPass: { cutOnNm: 590, slopeNm: 20, peak: 0.92 } }, form: 'longPass', param: 'cutOnNm', nm: 590 } },
    { label: '', on: 'light', values: [], edit: null },
  ],
} as unknown as PhotoLookView;

describe('live edits of a look', () => {
  it('move a filter edge and retune the light, keeping the rest of their sources', () => {
    expect(editedFilterSource(view.filters[0].edit!, 610)).toEqual({ longPass: { cutOnNm: 610, slopeNm: 20, peak: 0.92 } });
    expect(editedLightSource(view.light.edit!, 2900)).toEqual({ blackbody: 2900 });
    expect(editedLightSource({ ...view.light.edit!, kind: 'daylight', gels: [{ neutralDensity: 0.3 }] }, 5600)).toEqual({ daylight: 5600, gels: [{ neutralDensity: 0.3 }] });
  });

  it('become an unsaved look definition the server accepts', () => {
    const def = editedDefinition(look, view, { kelvin: 2900, filterNm: { 0: 610 } });
    const parsed = lookDefinitionSchema.safeParse(def);
    expect(parsed.success).toBe(true);
    expect(def.light).toEqual({ source: { blackbody: 2900 } });
    expect(def.filters?.[0]).toEqual({ on: 'lens', filter: { source: { longPass: { cutOnNm: 610, slopeNm: 20, peak: 0.92 } } } });
    expect(def.filters?.[1]).toBe(look.filters[1]);
    expect(def.medium).toBe(look.medium);
  });

  it('key the preview cache by what changed', () => {
    expect(hasEdits({})).toBe(false);
    expect(editsKey(view, {})).toBe(editsKey(view, { kelvin: 3200 }));
    expect(editsKey(view, { filterNm: { 0: 600 } })).not.toBe(editsKey(view, {}));
  });
});
