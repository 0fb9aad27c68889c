import { describe, expect, it } from 'vitest';
import { TONE_MEDIUM_IDS } from '../../../shared/tone/media-tone';
import { buildTonePipeline, srgbEncodeInline, type ToneSettingsLike } from '../../../shared/tone/tone-pipeline';
import { srgbEncode } from '../../../shared/spectral/colour';
import { random } from '../spectral/fixtures';
import { MAX_Q, MIN_STOPS, STOPS_Q, TONE_TABLE_SAMPLES, TONE_TABLE_STOPS, greyOfStops, outputCodes, toneCurveTable } from '../../../shared/look/tone-curve-table';

/** Tone settings that move every branch of the pipeline: development, rating, grade, print exposure, thresholds. */
const SETTINGS: Partial<ToneSettingsLike>[] = [
  {},
  { developmentStops: 1.5, ratingStops: 1, printGrade: 4, printExposureStops: 0.5 },
  { developmentStops: -1, ratingStops: -0.7, printGrade: -1, printExposureStops: -0.8, shadowDetailStops: 3, highlightRollOffStops: 2 },
  { printGrade: 5, printExposureStops: 1.3 },
];
const OFFSETS = [0, 0.7, -1.9];

/** The table's sample points (as toneCurveTable takes them), and points between and beyond them. */
function stopsToCheck(): number[] {
  const [lo, hi] = TONE_TABLE_STOPS;
  const step = (hi - lo) / (TONE_TABLE_SAMPLES - 1);
  const s: number[] = [];
  for (let i = 0; i < TONE_TABLE_SAMPLES; i++) s.push(lo + i * step, lo + (i + 0.37) * step);
  s.push(lo - 3, -40, hi + 2, 12);
  return s;
}

/** The tone table and output codes as written before the lean path (renderStops per sample, greyOfStops per code). */
function referenceTable(p: ReturnType<typeof buildTonePipeline>) {
  const [lo, hi] = TONE_TABLE_STOPS;
  const step = (hi - lo) / (TONE_TABLE_SAMPLES - 1);
  const grey = new Float32Array(TONE_TABLE_SAMPLES);
  let offsetStops = 0;
  for (let i = 0; i < TONE_TABLE_SAMPLES; i++) {
    const s = lo + i * step;
    const t = p.renderStops(s);
    grey[i] = t.srgb;
    if (i === TONE_TABLE_SAMPLES - 1) offsetStops = t.stops - s;
  }
  const table = { minStops: lo, step, grey, offsetStops };
  const codes = (top: number) => Array.from({ length: MAX_Q + 1 }, (_, i) => Math.round(greyOfStops(table, MIN_STOPS + i / STOPS_Q) * top));
  return { table, codes8: codes(255), codes16: codes(65535) };
}

describe('the tone pipeline’s lean grey path (srgbOfStops) and the tone table built from it', () => {
  it('encodes sRGB (IEC 61966-2-1) bit for bit as colour.ts srgbEncode, clamping included', () => {
    const rnd = random(3);
    const values = [-1, -0, 0, 1e-9, 0.0031308, 0.0031308 + 1e-18, 0.00313081, 0.04045, 0.18, 0.5, 1 - 1e-16, 1, 1.5, Number.NaN];
    for (let i = 0; i < 100000; i++) values.push(rnd() * 1.2 - 0.1, rnd() * 0.005);
    const bad = values.filter((v) => !Object.is(srgbEncodeInline(v), srgbEncode(v)));
    expect(bad).toEqual([]);
  });

  it('gives renderStops(s).srgb and .stops bit for bit, for every medium, several settings and key offsets', () => {
    const stops = stopsToCheck();
    for (const mediumId of TONE_MEDIUM_IDS) {
      for (const settings of SETTINGS) {
        for (const offsetStops of OFFSETS) {
          const p = buildTonePipeline({ mediumId, settings, offsetStops });
          let mismatches = 0;
          for (const s of stops) {
            const t = p.renderStops(s);
            if (!Object.is(p.srgbOfStops(s), t.srgb) || !Object.is(p.stopsAfterKey(s), t.stops)) mismatches++;
          }
          expect(mismatches, `${mediumId} ${JSON.stringify(settings)} offset ${offsetStops}`).toBe(0);
        }
      }
    }
  });

  it('tabulates the same tone table and output codes (8 and 16 bits) as renderStops and greyOfStops did', () => {
    for (const mediumId of TONE_MEDIUM_IDS) {
      for (const settings of [SETTINGS[0], SETTINGS[2]]) {
        const p = buildTonePipeline({ mediumId, settings, offsetStops: 0.7 });
        const ref = referenceTable(p);
        const t = toneCurveTable(p);
        expect(t.minStops).toBe(ref.table.minStops);
        expect(t.step).toBe(ref.table.step);
        expect(Object.is(t.offsetStops, ref.table.offsetStops)).toBe(true);
        expect(Buffer.from(t.grey.buffer).equals(Buffer.from(ref.table.grey.buffer)), `${mediumId} grey`).toBe(true);
        expect(Array.from(outputCodes(t, 8))).toEqual(ref.codes8);
        expect(Array.from(outputCodes(t, 16))).toEqual(ref.codes16);
      }
    }
  });
});
