import { describe, expect, it } from 'vitest';
import { filterSourceSchema, lightSourceSchema, mediumSourceSchema, simulateRequestSchema, swatchSourceSchema } from '../../../shared/schemas/simulate';

const firstIssue = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => {
  expect(r.success).toBe(false);
  const i = r.error!.issues[0];
  return { path: i.path.map(String).join('.'), message: i.message };
};

const base = { light: { cie: 'D65' }, medium: { id: 'panchromatic' } };

describe('the simulate schemas', () => {
  it('accept every documented form', () => {
    for (const l of [{ cie: 'F11' }, { daylight: 5600 }, { blackbody: 3200 }, { id: 'd65' }, { samples: [[400, 1], [550, 1], [700, 1]] }, { led: { emitterNm: 450, emitterWidthNm: 20, phosphorNm: 570, phosphorWidthNm: 130, phosphorRatio: 0.6 } }, { blackbody: 3200, gels: [{ id: 'cyan-530' }] }]) {
      expect(lightSourceSchema.safeParse(l).success, JSON.stringify(l)).toBe(true);
    }
    for (const f of [{ id: 'red-590' }, { samples: [[400, 0.1], [550, 0.5], [700, 0.9]] }, { samples: [[400, 1], [550, 0.5], [700, 0]], basis: 'density' }, { longPass: { cutOnNm: 550 } }, { shortPass: { cutOffNm: 500, slopeNm: 40, peak: 0.8 } }, { bandPass: { centreNm: 530, widthNm: 80 } }, { notch: { centreNm: 589, widthNm: 20 } }, { neutralDensity: 0.6 }]) {
      expect(filterSourceSchema.safeParse(f).success, JSON.stringify(f)).toBe(true);
    }
    for (const m of [{ id: 'eye' }, { samples: [[400, -1], [550, 0], [700, -2]], basis: 'log10' }]) expect(mediumSourceSchema.safeParse(m).success).toBe(true);
    for (const s of [{ name: 'a', srgb: '#aabbcc' }, { name: 'b', rgb: [1, 2, 3] }, { name: 'c', lab: [50, 10, -10] }, { name: 'd', reflectance: [[400, 10], [550, 20], [700, 30]], basis: 'percent' }]) {
      expect(swatchSourceSchema.safeParse(s).success, JSON.stringify(s)).toBe(true);
    }
  });
  it('need exactly one form', () => {
    expect(firstIssue(lightSourceSchema.safeParse({ cie: 'D65', daylight: 5600 })).message).toMatch(/not both cie and daylight/);
    expect(firstIssue(filterSourceSchema.safeParse({})).message).toMatch(/needs one of samples, id, longPass/);
  });
  it('name the field path of a bad sample, with the engine’s reason', () => {
    const r = firstIssue(simulateRequestSchema.safeParse({ ...base, swatches: [{ name: 'ok', srgb: '#000' }, { name: 'bad', reflectance: [[400, 0.1], [500, 0.2], [500, 0.3], [700, 0.1]] }] }));
    expect(r.path).toBe('swatches.1.reflectance.2.0');
    expect(r.message).toMatch(/500 nm appears twice/);
  });
  it('name non-numbers and ranges', () => {
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, filters: [{ samples: [[400, 'x'], [550, 1], [700, 1]] }] })).path).toBe('filters.0.samples.0.1');
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, light: { daylight: 3000 } })).path).toBe('light.daylight');
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, light: { cie: 'D75' } })).path).toBe('light.cie');
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, swatches: [{ name: 'x', srgb: 'red' }] })).path).toBe('swatches.0.srgb');
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, medium: { samples: [[420, 1], [550, 1], [700, 1]] } })).message).toMatch(/400–700 nm/);
  });
  it('refuse unknown keys and a basis without samples', () => {
    expect(firstIssue(simulateRequestSchema.safeParse({ ...base, extra: 1 })).message).toMatch(/extra|Unrecognized/i);
    expect(firstIssue(filterSourceSchema.safeParse({ id: 'red-590', basis: 'density' })).path).toBe('basis');
  });
  it('default filters and swatches to empty lists', () => {
    const r = simulateRequestSchema.parse(base);
    expect(r.filters).toEqual([]);
    expect(r.swatches).toEqual([]);
  });
});
