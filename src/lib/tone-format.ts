/** Signed stops with one decimal and the unit: +0.7 st, −1.3 st, 0.0 st. */
export function signedStops(v: number, digits = 1): string {
  const r = Number(v.toFixed(digits));
  if (r === 0) return `${(0).toFixed(digits)} st`;
  return `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(digits)} st`;
}

/** A grey 0..255 as a CSS colour. */
export function greyCss(g: number): string {
  const v = Math.max(0, Math.min(255, Math.round(g)));
  return `rgb(${v}, ${v}, ${v})`;
}

/** Black or white text, whichever reads on a background of grey `g` (0..255). */
export function inkOn(g: number): string {
  return g > 140 ? '#1b1a18' : '#ffffff';
}

/** Relative luminance-ish lightness of a hex colour (0..255) to choose text on it. */
export function hexLightness(hex: string): number {
  const n = parseInt(hex.slice(1), 16);
  return 0.2126 * ((n >> 16) & 255) + 0.7152 * ((n >> 8) & 255) + 0.0722 * (n & 255);
}
