import { describe, expect, it } from 'vitest';
import { eiChain, formatStops, roundToThirdStop } from '../../../shared/tone/ei-chain';

describe('EI chain (mechanics)', () => {
  it('returns box, rating and filter steps, each EI on the series', () => {
    const c = eiChain({ boxSpeed: 400, ratingStops: 1, filterStops: 2 });
    expect(c.steps.map((s) => s.step)).toEqual(['box', 'rating', 'filter']);
    expect(c.steps.map((s) => s.ei)).toEqual([400, 800, 200]);
    expect(c.steps[2].stops).toBe(-2);
    expect(c.totalStops).toBe(-1);
    expect(c.unfilteredEI).toBe(800);
    expect(c.effectiveEI).toBe(200);
  });

  it('defaults missing steps to 0 and rejects a bad box speed', () => {
    expect(eiChain({ boxSpeed: 100 }).effectiveEI).toBe(100);
    expect(() => eiChain({ boxSpeed: 0 })).toThrow(RangeError);
  });

  it('labels stops in thirds', () => {
    expect(formatStops(-0.667)).toBe('−⅔');
    expect(formatStops(1.667)).toBe('+1⅔');
    expect(formatStops(-1)).toBe('−1');
    expect(formatStops(0.1)).toBe('0');
    expect(formatStops(0.333)).toBe('+⅓');
    expect(roundToThirdStop(0.62)).toBeCloseTo(2 / 3, 12);
  });
});
