import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { LookAnalysis } from '../../../../shared/schemas/look';

const COLOURS: Record<string, string> = { light: '#c2410c', medium: '#1d5c7a', eye: '#77736b', product: '#1b1a18' };
const FILTER_COLOURS = ['#7a5bb0', '#3f9a5a', '#b08a1f', '#a22a2e', '#3b7fc4', '#6b4a3a', '#5e5e5e', '#d2692f'];

export interface SpectraChartProps {
  analysis: LookAnalysis;
  /** px (spectra-chart.tsx gives the default) */
  height?: number;
}

/**
 * Every curve of the light path and their product, each normalised to its peak (filters are already
 * transmittances 0..1 and are drawn as they are). Animations are off so the chart is stable to read and to capture.
 * Pages draw it through the lazy `SpectraChart` (spectra-chart.tsx), so recharts loads with the first chart.
 */
export function SpectraChartDrawing({ analysis, height }: SpectraChartProps & { height: number }) {
  const series = analysis.curves.map((c, i) => {
    const peak = Math.max(1e-12, ...c.values);
    const k = c.role === 'filter' ? 1 : 1 / peak;
    return { key: `c${i}`, label: c.role === 'filter' ? `${c.label} (${c.on})` : c.label, role: c.role, values: c.values.map((v) => v * k) };
  });
  const data = analysis.nm.map((nm, j) => Object.fromEntries([['nm', nm], ...series.map((s) => [s.key, Number(s.values[j].toFixed(4))])]));
  let f = 0;
  return (
    <figure aria-label="Curves of the light path and their product, normalised">
      <ResponsiveContainer width="100%" height={height}>
        <LineChart data={data} margin={{ top: 8, right: 12, bottom: 4, left: 0 }}>
          <CartesianGrid stroke="#e3dfd5" strokeDasharray="2 3" />
          <XAxis dataKey="nm" type="number" domain={[350, 900]} ticks={[400, 500, 600, 700, 800, 900]} tick={{ fontSize: 11 }} unit=" nm" />
          <YAxis domain={[0, 1]} ticks={[0, 0.25, 0.5, 0.75, 1]} tick={{ fontSize: 11 }} width={36} />
          <Tooltip isAnimationActive={false} formatter={(v) => (typeof v === 'number' ? v.toFixed(3) : v)} labelFormatter={(nm) => `${nm} nm`} />
          <Legend wrapperStyle={{ fontSize: 12 }} />
          {series.map((s) => {
            const colour = s.role === 'filter' ? FILTER_COLOURS[f++ % FILTER_COLOURS.length] : COLOURS[s.role];
            return (
              <Line key={s.key} dataKey={s.key} name={s.label} stroke={colour} dot={false} isAnimationActive={false}
                strokeWidth={s.role === 'product' ? 2.5 : 1.5} strokeDasharray={s.role === 'eye' ? '4 3' : undefined} />
            );
          })}
        </LineChart>
      </ResponsiveContainer>
      <figcaption className="mt-1 text-xs text-ink-mute">Light, medium, eye and product scaled to a peak of 1; filters as transmittance 0..1. 350–900 nm (the eye sees 360–830).</figcaption>
    </figure>
  );
}
