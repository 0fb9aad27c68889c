import { GRID_END_NM, GRID_START_NM } from '../../../../shared/spectral/policy';

/** A small SVG line of a spectrum (values 0..max over the working grid, 350–900 nm), for previews. Not interactive. */
export function SpectrumLine({ pairs, max, width = 220, height = 60, label }: { pairs: [number, number][]; max?: number; width?: number; height?: number; label: string }) {
  if (!pairs.length) return null;
  const top = max ?? Math.max(1e-9, ...pairs.map((p) => p[1]));
  const x = (nm: number) => ((nm - GRID_START_NM) / (GRID_END_NM - GRID_START_NM)) * width;
  const y = (v: number) => height - Math.min(1, Math.max(0, v / top)) * (height - 2) - 1;
  const d = pairs.map((p, i) => `${i ? 'L' : 'M'}${x(p[0]).toFixed(1)},${y(p[1]).toFixed(1)}`).join(' ');
  return (
    <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label} className="rounded border border-paper-line bg-paper">
      <defs>
        <linearGradient id="visible-band" x1="0" x2="1">
          <stop offset="0" stopColor="#6f4aa8" stopOpacity="0.12" />
          <stop offset="0.3" stopColor="#2f7fc0" stopOpacity="0.12" />
          <stop offset="0.45" stopColor="#3a9a55" stopOpacity="0.12" />
          <stop offset="0.6" stopColor="#d8c23a" stopOpacity="0.12" />
          <stop offset="0.75" stopColor="#d0662a" stopOpacity="0.12" />
          <stop offset="1" stopColor="#a3272b" stopOpacity="0.12" />
        </linearGradient>
      </defs>
      <rect width={width} height={height} fill="url(#visible-band)" />
      <path d={d} fill="none" stroke="#1b1a18" strokeWidth="1.5" />
    </svg>
  );
}
