import { useMemo } from 'react';
import { CartesianGrid, ComposedChart, Line, ReferenceArea, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import { buildTonePipeline, type ToneSettingsLike } from '../../../../shared/tone/tone-pipeline';
import { sampleCurve } from '../../../../shared/tone/characteristic-curve';
import { stopsFromZone } from '../../../../shared/tone/zones';
import { ZONES } from '../../../lib/zones';

/** A swatch to pin on the curve: its tone in stops from middle grey (key already placed unless `offsetStops`). */
export interface CurveSwatch {
  name: string;
  stops: number;
  /** its colour to the eye, CSS (e.g. '#a33b3b') */
  colour: string;
}

export interface CharacteristicCurveChartProps {
  /** the tone model's medium id */
  mediumId: string;
  settings?: Partial<ToneSettingsLike>;
  /** stops added to every swatch (the key placement) when the swatches' stops are not placed yet; default 0 */
  offsetStops?: number;
  boxSpeed?: number;
  swatches?: CurveSwatch[];
  /** px (characteristic-curve-chart.tsx gives the default) */
  height?: number;
  /** names are written beside the pins up to this many swatches (tooltips and the list below always name them) */
  maxLabels?: number;
  /** list the swatches under the chart (default true) */
  showList?: boolean;
}

const LOG2 = Math.log10(2);
const ZONE_FROM = -1;
const ZONE_TO = 11;

interface Pin { x: number; y: number; name: string; colour: string; zone: number; numeral: string; stops: number; density: number | null; grey: number; lost: boolean; blown: boolean }

/**
 * The characteristic curve of a look's medium after development (density against log₁₀ exposure in lux·s),
 * with the print's grey (sRGB 0–255, right axis), zone marks 0..X, the shadow-detail and highlight
 * thresholds shaded, and every swatch pinned where it lands. Sensors and the eye have no density curve:
 * the chart then shows the display grey against stops from middle grey. Pages draw it through the lazy
 * `CharacteristicCurveChart` (characteristic-curve-chart.tsx), so recharts loads with the first chart.
 */
export function CharacteristicCurveChartDrawing({ mediumId, settings, offsetStops = 0, boxSpeed, swatches = [], height, maxLabels = 6, showList = true }: CharacteristicCurveChartProps & { height: number }) {
  const model = useMemo(() => {
    const p = buildTonePipeline({ mediumId, settings, offsetStops, boxSpeed });
    const negative = p.curve !== null;
    const marks = p.zoneMarks();
    const greyLogH = negative ? marks[5].logH : 0;
    // x is log10 H (lux·s) for a negative, else stops from middle grey
    const xOfStops = (s: number) => (negative ? greyLogH + s * LOG2 : s);
    const stopsOfX = (x: number) => (negative ? (x - greyLogH) / LOG2 : x);
    const from = xOfStops(ZONE_FROM - 5);
    const to = xOfStops(ZONE_TO - 5);
    const line = negative
      ? sampleCurve(p.curve!, from, to, 161).map((pt) => ({ x: pt.logH, density: pt.density, grey: p.renderStops(stopsOfX(pt.logH) - offsetStops).srgb8 }))
      : Array.from({ length: 161 }, (_, i) => {
          const x = from + ((to - from) * i) / 160;
          return { x, density: null as number | null, grey: p.renderStops(x - offsetStops).srgb8 };
        });
    const pins: Pin[] = swatches.map((s) => {
      const r = p.renderStops(s.stops);
      const x = Math.min(to, Math.max(from, xOfStops(r.stops)));
      return { x, y: negative ? (r.density ?? 0) : r.srgb8, name: s.name, colour: s.colour, zone: r.zone, numeral: r.numeral, stops: r.stops, density: r.density, grey: r.srgb8, lost: r.lost, blown: r.blown };
    });
    const zones = ZONES.map(({ zone: z, numeral }) => ({ z, x: xOfStops(stopsFromZone(z)), numeral }));
    return {
      negative, line, pins, zones, from, to,
      shadowX: xOfStops(-p.shadowDetailStops),
      highlightX: xOfStops(p.highlightRollOffStops),
      dMax: negative ? Math.ceil((p.curve!.dMax + 0.1) * 2) / 2 : 255,
      xTicks: ticksBetween(from, to, negative ? 0.5 : 1),
      shadow: p.shadowDetailStops,
      highlight: p.highlightRollOffStops,
    };
  }, [mediumId, settings, offsetStops, boxSpeed, swatches]);

  const yKey = model.negative ? 'density' : 'grey';
  const yTicks = model.negative ? ticksBetween(0, model.dMax, 0.5) : [0, 64, 128, 192, 255];
  const tick = (v: number) => v.toFixed(1);
  return (
    <figure className="tabular-nums" data-testid="curve-chart">
      <div style={{ height }} role="img" aria-label={`Characteristic curve with zones 0 to X${swatches.length ? ` and ${swatches.length} swatches` : ''}`}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart margin={{ top: 18, right: 8, bottom: 18, left: 0 }}>
            <CartesianGrid stroke="#e4e0d6" strokeDasharray="2 3" />
            <ReferenceArea x1={model.from} x2={model.shadowX} yAxisId="y" fill="#fbe3d6" fillOpacity={0.6} ifOverflow="hidden" />
            <ReferenceArea x1={model.highlightX} x2={model.to} yAxisId="y" fill="#fbe3d6" fillOpacity={0.6} ifOverflow="hidden" />
            {model.zones.map((z) => (
              <ReferenceLine key={z.z} x={z.x} yAxisId="y" stroke={z.z === 5 ? '#1b1a18' : '#c9c4b8'} strokeDasharray={z.z === 5 ? undefined : '3 3'}
                label={{ value: z.numeral, position: 'top', fontSize: 10, fill: '#4a4742' }} />
            ))}
            <XAxis type="number" dataKey="x" domain={[model.from, model.to]} allowDataOverflow ticks={model.xTicks} tickFormatter={tick} fontSize={11}
              label={{ value: model.negative ? 'log₁₀ exposure (lux·s)' : 'stops from middle grey', position: 'insideBottom', offset: -12, fontSize: 11 }} />
            <YAxis yAxisId="y" type="number" domain={[0, model.dMax]} ticks={yTicks} tickFormatter={model.negative ? tick : (v: number) => String(v)} fontSize={11} width={40}
              label={{ value: model.negative ? 'density' : 'grey (sRGB)', angle: -90, position: 'insideLeft', offset: 10, fontSize: 11 }} />
            {model.negative && <YAxis yAxisId="g" orientation="right" type="number" domain={[0, 255]} fontSize={11} width={34} ticks={[0, 64, 128, 192, 255]} />}
            <Line data={model.line} yAxisId="y" dataKey={yKey} stroke="#1b1a18" strokeWidth={2} dot={false} activeDot={false} isAnimationActive={false} name={model.negative ? 'negative density' : 'display grey'} />
            {model.negative && <Line data={model.line} yAxisId="g" dataKey="grey" stroke="#1d5c7a" strokeWidth={1.5} strokeDasharray="5 3" dot={false} activeDot={false} isAnimationActive={false} name="print grey (sRGB)" />}
            <Scatter data={model.pins} yAxisId="y" dataKey="y" isAnimationActive={false} name="swatches"
              shape={(props: { cx?: number; cy?: number; payload?: Pin }) => <PinMark {...props} showLabel={model.pins.length <= maxLabels} />} />
            <Tooltip content={<PinTooltip />} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-[11px] text-ink-mute">
        <span><span className="inline-block h-0.5 w-4 bg-ink align-middle" /> {model.negative ? 'negative density' : 'display grey'}</span>
        {model.negative && <span><span className="inline-block w-4 border-t-2 border-dashed border-accent align-middle" /> print grey (sRGB, right)</span>}
        <span><span className="inline-block h-2 w-3 bg-warn-soft align-middle" /> texture lost under −{model.shadow.toFixed(1)} stops / blown over +{model.highlight.toFixed(1)} stops</span>
      </figcaption>
      {showList && model.pins.length > 0 && (
        <ul className="mt-2 flex flex-wrap gap-1.5 text-[11px]" aria-label="Swatches on the curve">
          {model.pins.map((p, i) => (
            <li key={`${p.name}-${i}`} className={`flex items-center gap-1 rounded border px-1.5 py-0.5 ${p.lost || p.blown ? 'border-warn/60 bg-warn-soft' : 'border-paper-line bg-paper-raised'}`}>
              <span className="inline-block h-2.5 w-2.5 rounded-full border border-ink/40" style={{ background: p.colour }} />
              <span className="[font-variant-numeric:normal]">{p.name}</span>
              <span className="text-ink-mute">zone {p.numeral}{p.density !== null ? `, D ${p.density.toFixed(2)}` : ''}{p.lost ? ', lost' : p.blown ? ', blown' : ''}</span>
            </li>
          ))}
        </ul>
      )}
    </figure>
  );
}

/** Round ticks every `step` inside [from, to]. */
function ticksBetween(from: number, to: number, step: number): number[] {
  const out: number[] = [];
  for (let v = Math.ceil(from / step) * step; v <= to + 1e-9; v += step) out.push(Number(v.toFixed(6)));
  return out;
}

function PinMark({ cx, cy, payload, showLabel }: { cx?: number; cy?: number; payload?: Pin; showLabel: boolean }) {
  if (cx === undefined || cy === undefined || !payload) return null;
  const flagged = payload.lost || payload.blown;
  return (
    <g>
      <circle cx={cx} cy={cy} r={5} fill={payload.colour} stroke={flagged ? '#c2410c' : '#1b1a18'} strokeWidth={1.5} />
      {showLabel && <text x={cx + 7} y={cy - 6} fontSize={10} fill="#4a4742">{payload.name}</text>}
    </g>
  );
}

function PinTooltip({ active, payload }: { active?: boolean; payload?: { payload?: Pin | { x: number } }[] }) {
  const p = payload?.find((e) => e.payload && 'name' in e.payload)?.payload as Pin | undefined;
  if (!active || !p) return null;
  return (
    <div className="rounded border border-paper-line bg-paper-raised px-2 py-1 text-xs shadow tabular">
      <div className="font-medium">{p.name}</div>
      <div>zone {p.numeral} ({p.zone.toFixed(1)}), {p.stops >= 0 ? '+' : '−'}{Math.abs(p.stops).toFixed(1)} stops</div>
      {p.density !== null && <div>density {p.density.toFixed(2)}</div>}
      <div>grey {p.grey} / 255{p.lost ? ' · texture lost' : p.blown ? ' · blown' : ''}</div>
    </div>
  );
}
