import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

export interface ChartSeries {
  label: string;
  /** `[nm, value]` pairs (any spacing) */
  pairs: [number, number][];
}

const COLOURS = ['#1b1a18', '#c2410c', '#1d5c7a', '#3f9a5a', '#7a5bb0', '#b08a1f'];

export interface CurveChartProps {
  series: ChartSeries[];
  yLabel: string;
  /** fixes the top of the scale, e.g. 1 for transmittance */
  yMax?: number;
  /** px (curve-chart.tsx gives the default) */
  height?: number;
}

/**
 * One or a few curves on 350–900 nm (values as given; `yMax` fixes the scale, e.g. 1 for transmittance). No
 * animation. Pages draw it through the lazy `CurveChart` (curve-chart.tsx), so recharts loads with the first chart.
 */
export function CurveChartDrawing({ series, yLabel, yMax, height }: CurveChartProps & { height: number }) {
  const nms = [...new Set(series.flatMap((s) => s.pairs.map((p) => p[0])))].sort((a, b) => a - b);
  const maps = series.map((s) => new Map(s.pairs));
  const data = nms.map((nm) => Object.fromEntries([['nm', nm], ...maps.map((m, i) => [`s${i}`, m.get(nm) ?? null])]));
  return (
    <figure aria-label={`Chart: ${series.map((s) => s.label).join(', ')}`}>
      <ResponsiveContainer width="100%" height={height}>
        <LineChart data={data} margin={{ top: 8, right: 12, bottom: 4, left: 0 }}>
          <CartesianGrid stroke="#e3dfd5" strokeDasharray="2 3" />
          <XAxis dataKey="nm" type="number" domain={['dataMin', 'dataMax']} tick={{ fontSize: 11 }} unit=" nm" />
          <YAxis domain={[0, yMax ?? 'auto']} tick={{ fontSize: 11 }} width={44} label={{ value: yLabel, angle: -90, position: 'insideLeft', fontSize: 11, dy: 40 }} />
          <Tooltip isAnimationActive={false} labelFormatter={(nm) => `${nm} nm`} formatter={(v) => (typeof v === 'number' ? v.toPrecision(4) : v)} />
          {series.length > 1 && <Legend wrapperStyle={{ fontSize: 12 }} />}
          {series.map((s, i) => <Line key={i} dataKey={`s${i}`} name={s.label} stroke={COLOURS[i % COLOURS.length]} dot={false} connectNulls isAnimationActive={false} strokeWidth={1.75} />)}
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}
