/**
 * A melanin sweep of the skin model spans light to dark skin. Individual typology angle
 * ITA° = atan((L* − 50)/b*)·180/π (L*a*b* under D65, CIE 1931 2°): its classes are those of J. Chardon,
 * I. Cretois, C. Hourseau, "Skin colour typology and suntanning pathways", Int. J. Cosmetic Science 13,
 * 1991, extended to six (brown, dark) by S. Del Bino et al. 2006 (from memory): very light > 55°, light
 * 41–55°, intermediate 28–41°, tan 10–28°, brown −30–10°, dark < −30°. Skin's hue angle h_ab lies roughly
 * 30–75° across the classes (from memory of published skin colorimetry across populations: skin is an
 * orange-red, a* and b* both positive, b* ≳ a* in light skin).
 */
import { describe, expect, it } from 'vitest';
import { resolveLightPath, simulateSwatches } from '../../../shared/spectral/compute';
import { skinReflectance } from '../../../shared/spectral/skin';
import { SKIN_PRESETS } from '../../../shared/spectral/skin-presets';
import type { SkinParams } from '../../../shared/spectral/sources';

/** The lightest skin of the sweep reaches above this ITA°, the darkest below the next (the brief's span; Chardon classes). */
const ITA_LIGHT_ABOVE = 50;
const ITA_DARK_BELOW = -20;
/** Hue angle range typical of skin, degrees (from memory). */
const HUE_MIN = 30;
const HUE_MAX = 75;
/** ITA° class bounds (Chardon et al. 1991; Del Bino et al. 2006), by preset id. */
const CLASSES: Record<string, [number, number]> = {
  'skin-very-light': [55, 90],
  'skin-light': [41, 55],
  'skin-intermediate': [28, 41],
  'skin-tan': [10, 28],
  'skin-brown': [-30, 10],
  'skin-dark': [-90, -30],
  'skin-very-dark': [-90, -30],
};

const eye = resolveLightPath({ light: { cie: 'D65' }, medium: { id: 'eye' } });
function colour(p: SkinParams) {
  const [L, a, b] = simulateSwatches(eye, [{ name: 's', reflectance: skinReflectance(p), estimated: false }]).swatches[0].lab;
  return { L, a, b, ita: (Math.atan((L - 50) / b) * 180) / Math.PI, hue: (Math.atan2(b, a) * 180) / Math.PI };
}

const SWEEP = [0.005, 0.01, 0.02, 0.03, 0.05, 0.07, 0.09, 0.12, 0.16, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45];

describe('a melanin sweep spans light to dark skin (ITA°, Chardon et al. 1991)', () => {
  const rows = SWEEP.map((melanin) => ({ melanin, ...colour({ melanin, blood: 0.02, oxygenation: 0.75 }) }));

  it(`ITA° runs from above ${ITA_LIGHT_ABOVE}° to below ${ITA_DARK_BELOW}°, falling steadily`, () => {
    expect(rows[0].ita).toBeGreaterThan(ITA_LIGHT_ABOVE);
    expect(rows[rows.length - 1].ita).toBeLessThan(ITA_DARK_BELOW);
    for (let i = 1; i < rows.length; i++) expect(rows[i].ita).toBeLessThan(rows[i - 1].ita);
  });

  it(`hue angles stay within ${HUE_MIN}–${HUE_MAX}° (skin's orange-red)`, () => {
    for (const r of rows) {
      expect(r.hue, `melanin ${r.melanin}`).toBeGreaterThanOrEqual(HUE_MIN);
      expect(r.hue, `melanin ${r.melanin}`).toBeLessThanOrEqual(HUE_MAX);
      expect(r.a).toBeGreaterThan(0);
      expect(r.b).toBeGreaterThan(0);
    }
  });

  it('each skin-tone preset falls in the ITA° class its note names', () => {
    for (const [id, [lo, hi]] of Object.entries(CLASSES)) {
      const preset = SKIN_PRESETS.find((p) => p.id === id)!;
      const c = colour(preset.skin);
      expect(c.ita, id).toBeGreaterThan(lo);
      expect(c.ita, id).toBeLessThanOrEqual(hi);
    }
  });
});
