import { describe, expect, it } from 'vitest';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';
import { LIBRARY_FILTERS, LIBRARY_LIGHTS, LIBRARY_MEDIA, LIBRARY_SOURCES } from '../../../shared/spectral/library';
import { CIE_TABLES, DAYLIGHT_INFO, OBSERVER_INFO } from '../../../shared/spectral/cie';

const GENERIC_NOTE = "generic model of a typical shape, not a manufacturer's data";

describe('the built-in library', () => {
  it('holds the required lights, filters and media', () => {
    expect(LIBRARY_LIGHTS.map((i) => i.id)).toEqual(['d65', 'd50', 'daylight-5600', 'tungsten-3200', 'tungsten-household', 'flame-1900', 'fluorescent-f2', 'fluorescent-f11', 'white-led']);
    expect(LIBRARY_MEDIA.map((i) => i.id)).toEqual(['blue-sensitive', 'orthochromatic', 'panchromatic', 'panchromatic-extended-red', 'infrared', 'silicon-ir-cut', 'eye']);
    for (const colour of ['yellow', 'deep-yellow', 'orange', 'red', 'deep-red', 'infrared', 'green', 'blue', 'cyan']) expect(LIBRARY_FILTERS.some((f) => f.id.startsWith(colour + '-'))).toBe(true);
  });
  it('marks every model as generic and names filters by colour and cut-on', () => {
    for (const i of [...LIBRARY_LIGHTS, ...LIBRARY_FILTERS, ...LIBRARY_MEDIA]) {
      expect(i.description.length).toBeGreaterThan(10);
      if (i.generic) expect(i.note).toBe(GENERIC_NOTE);
    }
    for (const f of LIBRARY_FILTERS.filter((x) => !x.id.startsWith('nd-'))) expect(f.name).toMatch(/(long-pass|short-pass|band-pass) \d{3} nm/);
  });
  it('resolves every item to the working grid’s 551 samples (350–900 nm at 1 nm)', () => {
    for (const i of LIBRARY_LIGHTS) expect(resolveLight({ id: i.id }).values).toHaveLength(551);
    for (const i of LIBRARY_FILTERS) expect(resolveFilter({ id: i.id }).values).toHaveLength(551);
    for (const i of LIBRARY_MEDIA) expect(resolveMedium({ id: i.id }).values).toHaveLength(551);
    for (const i of LIBRARY_MEDIA) expect(Math.max(...resolveMedium({ id: i.id }).values)).toBeCloseTo(1, 12);
  });
  it('names the source of every data file', () => {
    for (const t of Object.values(CIE_TABLES)) expect(t.source).toMatch(/CIE 015:2018.*colord-data/);
    expect(OBSERVER_INFO.source).toMatch(/CIE 1931/);
    expect(DAYLIGHT_INFO.source).toMatch(/S0, S1, S2/);
    for (const s of Object.values(LIBRARY_SOURCES)) expect(s.length).toBeGreaterThan(20);
  });
});
