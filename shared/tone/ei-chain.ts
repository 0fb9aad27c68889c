/**
 * The exposure-index chain: box speed → development / rating adjustment → filter factor → effective EI.
 * Each step is a change in stops; the EI after each step is computed exactly from the box speed and the
 * stops so far, then shown as the nearest label of the ISO third-stop series (no rounding is carried
 * from one step to the next).
 */
import { roundToIsoSeries } from './iso-series';

export interface EiChainInput {
  /** box speed, ISO arithmetic */
  boxSpeed: number;
  /** development / rating adjustment, stops (+ = rated faster, − = rated slower), e.g. −0.667 */
  ratingStops?: number;
  /** filter factor of the chosen filter for the chosen light and medium, stops of light lost (≥ 0 as a rule) */
  filterStops?: number;
}

export type EiStepName = 'box' | 'rating' | 'filter';

export interface EiChainStep {
  step: EiStepName;
  /** change of the EI at this step, stops (negative = slower); for the filter it is −filterStops */
  stops: number;
  /** the change so far, stops */
  totalStops: number;
  /** EI after this step, unrounded */
  exactEI: number;
  /** EI after this step on the ISO third-stop series */
  ei: number;
}

export interface EiChain {
  steps: EiChainStep[];
  /** total change from box speed to effective EI, stops */
  totalStops: number;
  /** the rated EI before the filter (box + rating), on the series */
  unfilteredEI: number;
  /** the effective EI, on the series */
  effectiveEI: number;
}

/** Box speed → rating → filter, in stops, each EI rounded to the ISO third-stop series. */
export function eiChain(input: EiChainInput): EiChain {
  const { boxSpeed } = input;
  const rating = input.ratingStops ?? 0;
  const filter = input.filterStops ?? 0;
  if (!(boxSpeed > 0) || !Number.isFinite(boxSpeed)) throw new RangeError('boxSpeed must be a positive number');
  if (!Number.isFinite(rating)) throw new RangeError('ratingStops must be a number');
  if (!Number.isFinite(filter)) throw new RangeError('filterStops must be a number');
  const steps: EiChainStep[] = [];
  let total = 0;
  const push = (step: EiStepName, stops: number) => {
    total += stops;
    const exactEI = boxSpeed * 2 ** total;
    steps.push({ step, stops, totalStops: total, exactEI, ei: roundToIsoSeries(exactEI) });
  };
  push('box', 0);
  push('rating', rating);
  push('filter', -filter);
  return { steps, totalStops: total, unfilteredEI: steps[1].ei, effectiveEI: steps[2].ei };
}

/** Stops rounded to the nearest third. */
export function roundToThirdStop(stops: number): number {
  return Math.round(stops * 3) / 3;
}

const THIRDS = ['', '⅓', '⅔'] as const;

/**
 * Stops as a trade label to the nearest third with its sign: 0.667 → "+⅔", −1.667 → "−1⅔", 1 → "+1", 0 → "0".
 */
export function formatStops(stops: number): string {
  const n = Math.round(stops * 3);
  if (n === 0) return '0';
  const sign = n < 0 ? '−' : '+';
  const whole = Math.floor(Math.abs(n) / 3);
  const third = Math.abs(n) % 3;
  return `${sign}${whole > 0 || third === 0 ? whole : ''}${THIRDS[third]}`;
}
