import { describe, expect, it } from 'vitest';
import { simulateRequestSchema, swatchSourceSchema } from '../../../shared/schemas/simulate';
import { resolveSwatch, simulate } from '../../../shared/spectral/compute';
import { GRID_SIZE } from '../../../shared/spectral/policy';
import { skinReflectance } from '../../../shared/spectral/skin';
import { BLOOD_PRESETS, SKIN_CONTROLS, SKIN_PRESETS, bruiseAt, CALM_SKIN } from '../../../shared/spectral/skin-presets';
import { makeupParamsSchema, needsUpsampleTable, skinParamsSchema } from '../../../shared/spectral/sources';
import { upsampleTable } from './fixtures';

const firstIssue = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => {
  expect(r.success).toBe(false);
  const i = r.error!.issues[0];
  return { path: i.path.map(String).join('.'), message: i.message };
};
const base = { light: { cie: 'D65' }, medium: { id: 'panchromatic' } };
const skin = { melanin: 0.03, blood: 0.02, oxygenation: 0.75 };

describe('the skin and makeup swatch forms', () => {
  it('accept skin, makeup with a hex or a nested source, and makeup over makeup', () => {
    for (const s of [
      { name: 'a', skin },
      { name: 'b', skin: { ...skin, pheomelanin: 0.5, bilirubin: 100, carotene: 20 } },
      { name: 'c', makeup: { over: { skin }, colour: '#b01c2e', coverage: 0.6 } },
      { name: 'd', makeup: { over: { srgb: '#d8a890' }, colour: { reflectance: [[400, 0.1], [550, 0.2], [700, 0.6]] }, coverage: 1 } },
      { name: 'e', makeup: { over: { makeup: { over: { skin }, colour: '#e0b090', coverage: 0.5 } }, colour: { lab: [40, 50, 20] }, coverage: 0.3 } },
    ]) {
      expect(swatchSourceSchema.safeParse(s).success, JSON.stringify(s)).toBe(true);
    }
  });

  it('refuse out-of-range values, naming the field', () => {
    const cases: [unknown, string, RegExp][] = [
      [{ name: 'x', skin: { ...skin, melanin: 0.6 } }, 'swatches.0.skin.melanin', /melanin .* 0 to 0\.5/],
      [{ name: 'x', skin: { ...skin, blood: -0.1 } }, 'swatches.0.skin.blood', /blood .* 0 to 0\.3/],
      [{ name: 'x', skin: { ...skin, oxygenation: 1.2 } }, 'swatches.0.skin.oxygenation', /oxygenation .* 0 to 1/],
      [{ name: 'x', skin: { ...skin, pheomelanin: 2 } }, 'swatches.0.skin.pheomelanin', /pheomelanin/],
      [{ name: 'x', skin: { ...skin, bilirubin: 5000 } }, 'swatches.0.skin.bilirubin', /bilirubin .*µmol\/L/],
      [{ name: 'x', skin: { ...skin, carotene: -1 } }, 'swatches.0.skin.carotene', /carotene/],
      [{ name: 'x', skin: { melanin: 0.1, blood: 0.02 } }, 'swatches.0.skin.oxygenation', /oxygenation/],
      [{ name: 'x', skin: { ...skin, melanin: 'lots' } }, 'swatches.0.skin.melanin', /melanin/],
      [{ name: 'x', makeup: { over: { skin }, colour: '#b01c2e', coverage: 1.5 } }, 'swatches.0.makeup.coverage', /coverage goes from 0 to 1/],
      [{ name: 'x', makeup: { over: { skin: { ...skin, blood: 0.9 } }, colour: '#b01c2e', coverage: 0.5 } }, 'swatches.0.makeup.over.skin.blood', /blood/],
      [{ name: 'x', makeup: { over: { skin }, colour: { srgb: 'red' }, coverage: 0.5 } }, 'swatches.0.makeup.colour.srgb', /sRGB colour like/],
    ];
    for (const [s, path, message] of cases) {
      const r = firstIssue(simulateRequestSchema.safeParse({ ...base, swatches: [s] }));
      expect(r.path, JSON.stringify(s)).toBe(path);
      expect(r.message).toMatch(message);
    }
  });

  it('refuse a name inside a makeup layer, two forms at once, and unknown skin keys', () => {
    expect(firstIssue(swatchSourceSchema.safeParse({ name: 'x', makeup: { over: { name: 'inner', skin }, colour: '#fff', coverage: 0.5 } })).path).toBe('makeup.over');
    expect(firstIssue(swatchSourceSchema.safeParse({ name: 'x', skin, srgb: '#ffffff' })).message).toMatch(/not both srgb and skin/);
    expect(firstIssue(skinParamsSchema.safeParse({ ...skin, freckles: 1 })).message).toMatch(/freckles|Unrecognized/i);
    expect(makeupParamsSchema.safeParse({ over: { skin }, colour: '#abc', coverage: 0 }).success).toBe(true);
  });

  it('refuse makeup nested deeper than allowed', () => {
    let src: Record<string, unknown> = { skin };
    for (let i = 0; i < 9; i++) src = { makeup: { over: src, colour: '#c08070', coverage: 0.2 } };
    expect(firstIssue(swatchSourceSchema.safeParse({ name: 'deep', ...src })).message).toMatch(/nest at most 8/);
  });

  it('know which sources need the upsampling table', () => {
    expect(needsUpsampleTable({ skin })).toBe(false);
    expect(needsUpsampleTable({ makeup: { over: { skin }, colour: { skin }, coverage: 0.5 } })).toBe(false);
    expect(needsUpsampleTable({ makeup: { over: { skin }, colour: '#fff', coverage: 0.5 } })).toBe(true);
    expect(needsUpsampleTable({ makeup: { over: { rgb: [1, 2, 3] }, colour: { skin }, coverage: 0.5 } })).toBe(true);
  });
});

describe('the skin model and its presets', () => {
  it('gives a reflectance on the working grid within 0..1; melanin darkens the blue, blood the green', () => {
    const r = skinReflectance(skin).values;
    expect(r.length).toBe(GRID_SIZE);
    expect(r.every((v) => v >= 0 && v <= 1)).toBe(true);
    const at = (p: typeof skin, nm: number) => skinReflectance(p).values[nm - 350];
    expect(at({ ...skin, melanin: 0.2 }, 450)).toBeLessThan(at(skin, 450));
    expect(at({ ...skin, blood: 0.08 }, 577)).toBeLessThan(at(skin, 577));
    expect(Math.abs(at({ ...skin, blood: 0.08 }, 800) - at(skin, 800))).toBeLessThan(0.1);
  });

  it('resolves skin as not estimated, makeup as estimated only when a colour value is in it', () => {
    const table = upsampleTable();
    expect(resolveSwatch({ name: 's', skin }, null).estimated).toBe(false);
    expect(resolveSwatch({ name: 'm', makeup: { over: { skin }, colour: { skin: { ...skin, blood: 0.3 } }, coverage: 0.5 } }, null).estimated).toBe(false);
    expect(resolveSwatch({ name: 'm', makeup: { over: { skin }, colour: '#b01c2e', coverage: 0.5 } }, table).estimated).toBe(true);
    expect(resolveSwatch({ name: 'm', makeup: { over: { srgb: '#d0a080' }, colour: { skin }, coverage: 0.5 } }, table).estimated).toBe(true);
  });

  it('answers each swatch’s reflectance with "spectra": true, rounded to 6 decimals', () => {
    const req = simulateRequestSchema.parse({ ...base, swatches: [{ name: 's', skin }], spectra: true });
    const res = simulate(req, null);
    const pairs = res.swatches[0].reflectance!;
    expect(pairs).toHaveLength(GRID_SIZE);
    expect(pairs[0][0]).toBe(350);
    expect(pairs[GRID_SIZE - 1][0]).toBe(900);
    const exact = skinReflectance(skin).values;
    pairs.forEach(([, v], i) => {
      expect(Math.abs(v - exact[i])).toBeLessThanOrEqual(5e-7);
      expect(Math.round(v * 1e6) / 1e6).toBe(v);
    });
    expect(simulate(simulateRequestSchema.parse({ ...base, swatches: [{ name: 's', skin }] }), null).swatches[0].reflectance).toBeUndefined();
  });

  it('presets and blood layers are valid sources; controls cover every parameter', () => {
    for (const p of SKIN_PRESETS) expect(swatchSourceSchema.safeParse({ name: p.name, skin: p.skin }).success, p.id).toBe(true);
    for (const p of BLOOD_PRESETS) expect(swatchSourceSchema.safeParse({ name: p.name, makeup: p.makeup }).success, p.id).toBe(true);
    expect(new Set(SKIN_PRESETS.map((p) => p.id)).size).toBe(SKIN_PRESETS.length);
    const keys = SKIN_CONTROLS.map((c) => c.key);
    for (const k of ['melanin', 'blood', 'oxygenation', 'pheomelanin', 'bilirubin', 'carotene', 'bruiseAgeDays']) expect(keys).toContain(k);
    for (const c of SKIN_CONTROLS) expect(c.min < c.max && c.step > 0 && c.label.length > 0).toBe(true);
  });

  it('the bruise-age control adds pooled blood that loses its oxygen and yellows, then fades', () => {
    const fresh = bruiseAt(0.5, CALM_SKIN);
    const old = bruiseAt(5, CALM_SKIN);
    const gone = bruiseAt(14, CALM_SKIN);
    expect(fresh.blood).toBeGreaterThan(old.blood);
    expect(old.blood).toBeGreaterThan(gone.blood);
    expect(fresh.oxygenation).toBeLessThan(CALM_SKIN.oxygenation);
    expect(old.bilirubin!).toBeGreaterThan(fresh.bilirubin!);
    expect(bruiseAt(0, CALM_SKIN).bilirubin).toBe(0);
    expect(skinParamsSchema.safeParse(bruiseAt(5, CALM_SKIN)).success).toBe(true);
  });
});
