/** Figures of the lamp plan as the page writes them (units on every number). */

/** Stops with a sign and one decimal: "+1.6 stops", "−0.4 stops", "0.0 stops". */
export function formatPlanStops(stops: number): string {
  const r = Number(stops.toFixed(1));
  if (r === 0) return '0.0 stops';
  return `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(1)} stops`;
}

/** The total against the need in words: "1.6 stops over the need", "short by 0.4 stops", "on the need". */
export function describeAgainstNeed(stops: number): string {
  const a = Math.abs(stops);
  if (a < 0.05) return 'on the level needed';
  return stops > 0 ? `${a.toFixed(1)} stops more than needed` : `${a.toFixed(1)} stops short of the need`;
}

/** Metres: "2.35 m". */
export function formatMetres(m: number): string {
  return `${Number(m.toPrecision(3))} m`;
}
