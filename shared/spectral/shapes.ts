/** Smooth building blocks of the parametric models (filters, media, LED). Pure functions of nm. */

/** A Gaussian band of peak 1 at `centreNm` with full width at half maximum `fwhmNm`, nm. */
export function gaussian(nm: number, centreNm: number, fwhmNm: number): number {
  const sigma = fwhmNm / (2 * Math.sqrt(2 * Math.LN2));
  return Math.exp(-0.5 * ((nm - centreNm) / sigma) ** 2);
}

/** ln 81: a logistic rises from 10 % to 90 % over this many units of its scale parameter. */
const TEN_TO_NINETY = 2 * Math.log(9);

/**
 * A rising logistic edge: 0.5 at `edgeNm`, rising from 10 % to 90 % over `widthNm` (nm).
 * 1 − edge is the matching falling edge.
 */
export function risingEdge(nm: number, edgeNm: number, widthNm: number): number {
  const s = Math.max(widthNm, 1e-6) / TEN_TO_NINETY;
  return 1 / (1 + Math.exp(-(nm - edgeNm) / s));
}
