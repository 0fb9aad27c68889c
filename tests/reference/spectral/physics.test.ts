/** Physics checks of the model (DESIGN.md §3): consequences of the definitions, no outside figures. */
import { describe, expect, it } from 'vitest';
import { prepareLightPath, resolveLightPath, simulateSwatches, type ResolvedSwatch } from '../../../shared/spectral/compute';
import { LIBRARY_FILTERS, LIBRARY_LIGHTS, LIBRARY_MEDIA } from '../../../shared/spectral/library';
import { eyeMedium } from '../../../shared/spectral/media';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { flat, fromFn } from '../../unit/spectral/fixtures';

/** Default tolerance: 1e-9 stops (the identities are exact up to rounding). */
const TOL = 1e-9;

/** A red surface: low below 580 nm, high above (a generic red paint shape). */
const RED = fromFn((nm) => 0.05 + 0.75 / (1 + Math.exp(-(nm - 600) / 12)));
const GREY = flat(0.18);

const swatch = (name: string, reflectance = GREY): ResolvedSwatch => ({ name, reflectance, estimated: false });

describe('physics of the model', () => {
  it('a red swatch reads darker on the orthochromatic model than on the panchromatic one (daylight and tungsten)', () => {
    for (const light of ['d65', 'tungsten-3200']) {
      const on = (medium: string) => simulateSwatches(resolveLightPath({ light: { id: light }, medium: { id: medium } }), [swatch('red', RED)]).swatches[0].stops;
      expect(on('orthochromatic')).toBeLessThan(on('panchromatic') - 1);
    }
  });

  it('a neutral grey keeps its stops through any filter, on any medium, under any light', () => {
    for (const l of LIBRARY_LIGHTS) {
      for (const m of LIBRARY_MEDIA) {
        const plain = simulateSwatches(resolveLightPath({ light: { id: l.id }, medium: { id: m.id } }), [swatch('grey')]).swatches[0];
        expect(Math.abs(plain.stops)).toBeLessThanOrEqual(TOL);
        for (const f of LIBRARY_FILTERS) {
          const r = simulateSwatches(resolveLightPath({ light: { id: l.id }, filters: [{ id: f.id }], medium: { id: m.id } }), [swatch('grey')]).swatches[0];
          expect(Math.abs(r.stops - plain.stops), `${l.id} ${f.id} ${m.id}`).toBeLessThanOrEqual(TOL);
        }
      }
    }
  });

  it('under the eye medium without filters, every swatch has shift 0', () => {
    for (const l of LIBRARY_LIGHTS) {
      const lightPath = prepareLightPath({ light: l.id === 'd65' ? cieIlluminant('D65') : resolveLightPath({ light: { id: l.id }, medium: { id: 'eye' } }).light, medium: eyeMedium() });
      const res = simulateSwatches(lightPath, [swatch('grey'), swatch('red', RED), swatch('white', flat(0.9))]);
      for (const s of res.swatches) expect(Math.abs(s.shift), `${l.id} ${s.name}`).toBeLessThanOrEqual(TOL);
    }
  });

  it('middle grey sits in zone V, one stop a zone', () => {
    const lightPath = resolveLightPath({ light: { cie: 'D65' }, medium: { id: 'panchromatic' } });
    const [grey, double] = simulateSwatches(lightPath, [swatch('grey'), swatch('double', flat(0.36))]).swatches;
    expect(Math.abs(grey.zone - 5)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(double.zone - 6)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(double.eyeStops - 1)).toBeLessThanOrEqual(TOL);
  });

  it('filters only take light away: every preset costs ≥ 0 stops', () => {
    for (const f of LIBRARY_FILTERS) expect(resolveLightPath({ light: { cie: 'D65' }, filters: [{ id: f.id }], medium: { id: 'panchromatic' } }).factor.stops).toBeGreaterThanOrEqual(0);
  });
});
