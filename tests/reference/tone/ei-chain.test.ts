import { describe, expect, it } from 'vitest';
import { eiChain } from '../../../shared/tone/ei-chain';
import { describeLightCost, lightCost } from '../../../shared/tone/light-level';

// Facts of the trade (common practice):
/** box speed in daylight */
const BOX_SPEED = 250;
/** pulled half a stop and rated two-thirds of a stop slower */
const RATING_STOPS = -0.667;
const RATED_EI = 160;
/** a one-stop filter in daylight */
const DAYLIGHT_FILTER_STOPS = 1;
const DAYLIGHT_EI = 80;
/** under tungsten the filter costs two-thirds of a stop more */
const TUNGSTEN_FILTER_STOPS = 1 + 0.667;
const TUNGSTEN_EI = 50;

describe('exposure-index chain (facts of the trade, common practice)', () => {
  it('box 250 rated two-thirds slower gives 160', () => {
    expect(eiChain({ boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS }).effectiveEI).toBe(RATED_EI);
  });

  it('a one-stop filter then gives 80', () => {
    const c = eiChain({ boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: DAYLIGHT_FILTER_STOPS });
    expect(c.steps.map((s) => s.ei)).toEqual([BOX_SPEED, RATED_EI, DAYLIGHT_EI]);
    expect(c.effectiveEI).toBe(DAYLIGHT_EI);
  });

  it('under tungsten, with the filter costing two-thirds of a stop more, 50', () => {
    const c = eiChain({ boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: TUNGSTEN_FILTER_STOPS });
    expect(c.effectiveEI).toBe(TUNGSTEN_EI);
    // and the look's cost in light against the unfiltered one: 160 / 50 = 3.2 (arithmetic)
    const cost = lightCost(c.effectiveEI, c.unfilteredEI);
    expect(cost.ratio).toBeCloseTo(3.2, 12);
    expect(describeLightCost(cost.ratio)).toBe('needs 3.2× the light of the unfiltered one');
  });
});
