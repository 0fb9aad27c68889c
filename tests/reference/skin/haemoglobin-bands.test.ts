/**
 * The haemoglobin bands in the skin model's reflectance (shared/spectral/skin.ts): well-oxygenated skin with
 * enough blood shows oxyhaemoglobin's two Q bands (α and β) as reflectance minima, deoxygenated skin one broad
 * band. Expected positions from S. Prahl, "Tabulated molar extinction coefficient for hemoglobin in water",
 * OMLC 1998 (the maxima of the table carried in data/skin/haemoglobin-prahl-1998.json: HbO2 542 and 576–577 nm,
 * Hb 554–556 nm), and the textbook statement of them (oxyhaemoglobin 542/577 nm, deoxyhaemoglobin ~555 nm).
 */
import { describe, expect, it } from 'vitest';
import { GRID_NM } from '../../../shared/spectral/grid';
import { skinReflectance } from '../../../shared/spectral/skin';

/** Default tolerance of this file: ±4 nm on a band position (the brief's window). */
const TOL_NM = 4;
/** Oxyhaemoglobin β band, nm (Prahl 1998 / OMLC). */
const OXY_BETA_NM = 542;
/** Oxyhaemoglobin α band, nm (Prahl 1998 / OMLC). */
const OXY_ALPHA_NM = 577;
/** Deoxyhaemoglobin's single band, nm (Prahl 1998 / OMLC). */
const DEOXY_NM = 555;

/** Local minima of a reflectance between `from` and `to` nm. */
function minima(values: Float64Array, from = 500, to = 620): number[] {
  const out: number[] = [];
  for (let i = 1; i < values.length - 1; i++) {
    const nm = GRID_NM[i];
    if (nm > from && nm < to && values[i] < values[i - 1] && values[i] <= values[i + 1]) out.push(nm);
  }
  return out;
}

const LIGHT_SKIN = { melanin: 0.03 };

describe('haemoglobin bands in skin reflectance (Prahl 1998)', () => {
  it.each([0.01, 0.02, 0.05, 0.1])('oxygenated skin (saturation 0.98, blood %f) has two minima near 542 and 577 nm', (blood) => {
    const m = minima(skinReflectance({ ...LIGHT_SKIN, blood, oxygenation: 0.98 }).values);
    expect(m).toHaveLength(2);
    expect(Math.abs(m[0] - OXY_BETA_NM)).toBeLessThanOrEqual(TOL_NM);
    expect(Math.abs(m[1] - OXY_ALPHA_NM)).toBeLessThanOrEqual(TOL_NM);
  });

  it.each([0.01, 0.02, 0.05, 0.1])('deoxygenated skin (saturation 0, blood %f) has one broad minimum near 555 nm', (blood) => {
    const m = minima(skinReflectance({ ...LIGHT_SKIN, blood, oxygenation: 0 }).values);
    expect(m).toHaveLength(1);
    expect(Math.abs(m[0] - DEOXY_NM)).toBeLessThanOrEqual(TOL_NM);
  });

  it('the bands hold across skin tones (oxygenated, blood 5 %)', () => {
    for (const melanin of [0.01, 0.05, 0.1, 0.2]) {
      const m = minima(skinReflectance({ melanin, blood: 0.05, oxygenation: 0.98 }).values);
      expect(m, `melanin ${melanin}`).toHaveLength(2);
      expect(Math.abs(m[0] - OXY_BETA_NM)).toBeLessThanOrEqual(TOL_NM);
      expect(Math.abs(m[1] - OXY_ALPHA_NM)).toBeLessThanOrEqual(TOL_NM);
    }
  });
});
