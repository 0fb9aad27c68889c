import { describe, expect, it } from 'vitest';
import { TONE_MEDIUM_IDS, mediumToneDefaults } from '../../../shared/tone/media-tone';
import { curveForIsoSpeed, isoSpeedOfCurve } from '../../../shared/tone/iso-speed';

/** Fact of the trade (common practice): on classic media texture goes about 4 stops under the key. */
const CLASSIC_THRESHOLD_STOPS = 4;
/** Fact of the trade (common practice): on modern negatives about 5 stops. */
const MODERN_THRESHOLD_STOPS = 5;

describe('tone defaults per medium', () => {
  it.each([
    ['classic', CLASSIC_THRESHOLD_STOPS, ['medium.blue-sensitive', 'medium.orthochromatic']],
    ['modern', MODERN_THRESHOLD_STOPS, ['medium.panchromatic', 'medium.panchromatic-extended-red']],
  ] as const)('%s media lose detail %d stops under the key (fact of the trade, common practice)', (family, thresholdStops, ids) => {
    for (const id of ids) {
      const d = mediumToneDefaults(id);
      expect(d.kind).toBe('negative');
      expect(d.family).toBe(family);
      expect(d.shadowDetailStops).toBe(thresholdStops);
    }
  });

  it('silicon is a sensor with a display curve, the eye is the reference', () => {
    expect(mediumToneDefaults('medium.silicon-ir-cut').kind).toBe('sensor');
    expect(mediumToneDefaults('medium.eye').kind).toBe('eye');
    expect(mediumToneDefaults('medium.eye').boxSpeed).toBeNull();
  });

  it('falls back for unknown ids and says so', () => {
    const d = mediumToneDefaults('medium.custom-42');
    expect(d.known).toBe(false);
    expect(d.family).toBe('modern');
    expect(mediumToneDefaults('medium.silicon-mono').kind).toBe('sensor');
    expect(TONE_MEDIUM_IDS.every((id) => mediumToneDefaults(id).known)).toBe(true);
  });

  it('every negative builds a normal curve whose ISO 6 speed is its box speed', () => {
    for (const id of TONE_MEDIUM_IDS) {
      const d = mediumToneDefaults(id);
      if (d.kind !== 'negative') continue;
      const iso = isoSpeedOfCurve(curveForIsoSpeed(d.shape, d.boxSpeed));
      expect(iso.nominalSpeed).toBe(d.boxSpeed);
      expect(iso.contrastMet).toBe(true);
    }
  });
});

describe('the built-in library', () => {
  it('has tone defaults for every built-in medium id', async () => {
    const media = (await import('../../../data/library/media.json')).default as { media?: { id: string }[]; items?: { id: string }[] };
    const list = (media.media ?? media.items ?? []) as { id: string }[];
    expect(list.length).toBeGreaterThanOrEqual(6);
    for (const m of list) expect(mediumToneDefaults(m.id).known).toBe(true);
  });
});
