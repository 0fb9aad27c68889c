/**
 * The merges of a board, per swatch, against a brute-force reference over every pair (the rule of
 * server/modules/tones/board-merges.ts: plausible ranges within `mergeStops` of each other, CIEDE2000 by
 * culori above `mergeDeltaE`; `certain` when both ranges lie within the threshold entirely).
 */
import { describe, expect, it } from 'vitest';
import { ciede2000, findMerges } from '../../../server/modules/tones/board-merges';
import { MERGE_PARTNERS_KEPT, type SwatchTone } from '../../../shared/schemas/board';

/** A small LCG, so every run checks the same swatches. */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

/**
 * Random tones: stops in −4..4 with plausible ranges 0..1.5 stops wide (a fifth measured: zero width), and
 * L*a*b* spread over the gamut, including some greys (a = b = 0) and some lit above L* 100.
 */
function randomTones(n: number, seed: number): SwatchTone[] {
  const r = rng(seed);
  return Array.from({ length: n }, (_, i) => {
    const stops = r() * 8 - 4;
    const w = r() < 0.2 ? 0 : r() * 1.5;
    const lo = stops - r() * w;
    const grey = r() < 0.05;
    const lab: [number, number, number] = [r() * 115, grey ? 0 : r() * 200 - 100, grey ? 0 : r() * 200 - 100];
    return { swatchId: 1000 + i * 3, stops, eyeStops: stops, shift: 0, zone: 5 + stops, numeral: 'V', grey: 128, lost: false, blown: false, lab, range: { possible: [lo - 0.1, lo + w + 0.1], plausible: [lo, lo + w] } };
  });
}

interface RefPair {
  a: number;
  b: number;
  certain: boolean;
  deltaE: number;
  apart: number;
}

/** Every pair, the slow way. */
function allPairs(tones: SwatchTone[], mergeStops: number, mergeDeltaE: number): RefPair[] {
  const out: RefPair[] = [];
  for (let i = 0; i < tones.length; i++) {
    for (let j = i + 1; j < tones.length; j++) {
      const [x, y] = [tones[i], tones[j]];
      const gap = Math.max(x.range.plausible[0], y.range.plausible[0]) - Math.min(x.range.plausible[1], y.range.plausible[1]);
      if (gap > mergeStops) continue;
      const deltaE = ciede2000(x.lab, y.lab);
      if (deltaE <= mergeDeltaE) continue;
      const certain = Math.max(x.range.plausible[1], y.range.plausible[1]) - Math.min(x.range.plausible[0], y.range.plausible[0]) <= mergeStops;
      out.push({ a: x.swatchId, b: y.swatchId, certain, deltaE, apart: Math.abs(x.stops - y.stops) });
    }
  }
  return out;
}

describe('findMerges against every pair', () => {
  for (const [n, seed, mergeStops, mergeDeltaE] of [
    [300, 1, 1 / 3, 10],
    [400, 2, 0.1, 25],
    [250, 3, 1, 5],
    [300, 4, 1 / 3, 40],
  ] as const) {
    it(`${n} random swatches, within ${mergeStops.toFixed(2)} stop and over ΔE ${mergeDeltaE}`, () => {
      const tones = randomTones(n, seed);
      const ref = allPairs(tones, mergeStops, mergeDeltaE);
      const got = findMerges(tones, mergeStops, mergeDeltaE);
      expect(ref.length).toBeGreaterThan(50);
      expect(got.mergeCount).toBe(ref.length);
      expect(got.certainMergeCount).toBe(ref.filter((p) => p.certain).length);
      const stopsOf = new Map(tones.map((t) => [t.swatchId, t.stops]));
      let capped = 0;
      for (const t of tones) {
        const mine = ref.filter((p) => p.a === t.swatchId || p.b === t.swatchId).map((p) => ({ ...p, other: p.a === t.swatchId ? p.b : p.a }));
        const m = got.merges.find((x) => x.swatchId === t.swatchId);
        if (!mine.length) {
          expect(m).toBeUndefined();
          continue;
        }
        expect(m!.count).toBe(mine.length);
        expect(m!.certainCount).toBe(mine.filter((p) => p.certain).length);
        expect(m!.partners.length).toBe(Math.min(MERGE_PARTNERS_KEPT, mine.length));
        if (mine.length > MERGE_PARTNERS_KEPT) capped++;
        // the partners kept are the first of the reference's own order: certain first, then nearest on the medium
        const key = (p: { certain: boolean; apart: number }) => (p.certain ? 0 : 1e9) + p.apart;
        const want = [...mine].sort((x, y) => key(x) - key(y)).slice(0, MERGE_PARTNERS_KEPT);
        expect(m!.partners.map((p) => key({ certain: p.certain, apart: Math.abs(stopsOf.get(p.swatchId)! - t.stops) }))).toEqual(want.map(key));
        for (const p of m!.partners) {
          const r = mine.find((x) => x.other === p.swatchId)!;
          expect(r, `${t.swatchId} with ${p.swatchId}`).toBeDefined();
          expect(p.certain).toBe(r.certain);
          expect(p.deltaE).toBe(Math.ceil(r.deltaE * 100) / 100); // rounded up to 0.01
        }
      }
      expect(capped).toBeGreaterThan(0);
      // swatches in the order of the tones
      const at = new Map(tones.map((t, i) => [t.swatchId, i]));
      const idx = got.merges.map((m) => at.get(m.swatchId)!);
      expect(idx).toEqual([...idx].sort((x, y) => x - y));
    });
  }

  it('finds nothing with no threshold on the eye (a single swatch through every look)', () => {
    expect(findMerges(randomTones(50, 5), 1 / 3, Infinity)).toEqual({ merges: [], mergeCount: 0, certainMergeCount: 0 });
  });
});
