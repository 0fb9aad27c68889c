/**
 * The makeup layer (shared/spectral/makeup.ts, Kubelka 1948) and the skin model's ranges: full coverage gives
 * the paint's own reflectance, zero coverage the skin, in between it moves monotonically; every reflectance
 * of the models lies within 0..1 (a reflectance cannot exceed the perfect white: the definition).
 */
import { describe, expect, it } from 'vitest';
import { resolveSwatch } from '../../../shared/spectral/compute';
import { makeupOver } from '../../../shared/spectral/makeup';
import { skinReflectance } from '../../../shared/spectral/skin';
import { BLOOD_PRESETS, CALM_SKIN, SKIN_PRESETS, bruiseAt } from '../../../shared/spectral/skin-presets';
import { SKIN_LIMITS } from '../../../shared/spectral/sources';
import { fromFn, random, upsampleTable } from '../../unit/spectral/fixtures';

/** Default tolerance of this file (exact up to rounding). */
const TOL = 1e-12;

const inUnit = (v: Float64Array) => v.every((x) => x >= 0 && x <= 1);

describe('makeup over skin (Kubelka–Munk layer)', () => {
  const skin = skinReflectance(CALM_SKIN);
  const lip = fromFn((nm) => 0.04 + 0.6 / (1 + Math.exp(-(nm - 610) / 15)));

  it('coverage 1 is the paint, coverage 0 the skin', () => {
    const full = makeupOver(skin, lip, 1).values;
    const none = makeupOver(skin, lip, 0).values;
    for (let i = 0; i < full.length; i++) {
      expect(Math.abs(full[i] - lip.values[i])).toBeLessThanOrEqual(TOL);
      expect(Math.abs(none[i] - skin.values[i])).toBeLessThanOrEqual(TOL);
    }
  });

  it('moves monotonically from the skin to the paint, approaching it as coverage nears 1', () => {
    let prev = skin.values;
    for (const c of [0.1, 0.3, 0.5, 0.7, 0.9, 0.99, 0.99999]) {
      const r = makeupOver(skin, lip, c).values;
      for (let i = 0; i < r.length; i++) {
        const lo = Math.min(skin.values[i], lip.values[i]) - TOL;
        const hi = Math.max(skin.values[i], lip.values[i]) + TOL;
        expect(r[i]).toBeGreaterThanOrEqual(lo);
        expect(r[i]).toBeLessThanOrEqual(hi);
        expect(Math.abs(r[i] - lip.values[i])).toBeLessThanOrEqual(Math.abs(prev[i] - lip.values[i]) + TOL);
      }
      prev = r;
    }
    const near = makeupOver(skin, lip, 0.99999).values;
    for (let i = 0; i < near.length; i++) expect(Math.abs(near[i] - lip.values[i])).toBeLessThan(1e-3);
  });

  it('a hex paint is estimated, and full coverage gives its estimate', () => {
    const table = upsampleTable();
    const paint = resolveSwatch({ name: 'p', srgb: '#b01c2e' }, table);
    const r = resolveSwatch({ name: 'lip', makeup: { over: { skin: CALM_SKIN }, colour: '#b01c2e', coverage: 1 } }, table);
    expect(r.estimated).toBe(true);
    for (let i = 0; i < r.reflectance.values.length; i++) expect(Math.abs(r.reflectance.values[i] - paint.reflectance.values[i])).toBeLessThanOrEqual(TOL);
    expect(resolveSwatch({ name: 'blood', makeup: BLOOD_PRESETS[0].makeup }, null).estimated).toBe(false);
  });
});

describe('every reflectance of the models lies within 0..1', () => {
  it('over random parameters across their ranges, the presets, bruises and blood layers', () => {
    const rnd = random(12);
    const pick = (k: keyof typeof SKIN_LIMITS) => SKIN_LIMITS[k].min + rnd() * (SKIN_LIMITS[k].max - SKIN_LIMITS[k].min);
    for (let n = 0; n < 200; n++) {
      const p = { melanin: pick('melanin'), blood: pick('blood'), oxygenation: pick('oxygenation'), pheomelanin: pick('pheomelanin'), bilirubin: pick('bilirubin'), carotene: pick('carotene') };
      const r = skinReflectance(p);
      expect(inUnit(r.values), JSON.stringify(p)).toBe(true);
      expect(inUnit(makeupOver(r, skinReflectance(CALM_SKIN), rnd()).values)).toBe(true);
    }
    for (const limits of [0, 1]) {
      const p = { melanin: limits ? 0.5 : 0, blood: limits ? 0.3 : 0, oxygenation: limits, pheomelanin: limits, bilirubin: limits * 1000, carotene: limits * 300 };
      expect(inUnit(skinReflectance(p).values)).toBe(true);
    }
    for (const p of SKIN_PRESETS) expect(inUnit(skinReflectance(p.skin).values), p.id).toBe(true);
    for (const d of [0, 0.5, 1, 3, 5, 10, 14]) expect(inUnit(skinReflectance(bruiseAt(d, CALM_SKIN)).values)).toBe(true);
    for (const b of BLOOD_PRESETS) expect(inUnit(resolveSwatch({ name: b.id, makeup: b.makeup }, null).reflectance.values), b.id).toBe(true);
  });
});
