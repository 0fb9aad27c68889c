import type { LookAnalysis } from '../../../../shared/schemas/look';

/** The light path of a look in one line: light → filters (lens / light) → medium. */
export function LookPathLine({ analysis }: { analysis: LookAnalysis }) {
  const parts = analysis.curves.filter((c) => c.role !== 'eye' && c.role !== 'product').map((c) => (c.role === 'filter' ? `${c.label} (on the ${c.on})` : c.label));
  return <p className="text-xs text-ink-soft">{parts.join(' → ')}</p>;
}

/** The filter factor for the look's light, daylight and tungsten, compactly. */
export function FactorLine({ analysis }: { analysis: LookAnalysis }) {
  const f = (x: LookAnalysis['factor']) => (x.opaque ? 'opaque' : `${x.stops.toFixed(2)} st ×${x.factor.toFixed(2)}`);
  return (
    <dl className="grid grid-cols-3 gap-2 text-xs tabular">
      <div><dt className="text-ink-mute">this light</dt><dd className="font-semibold">{f(analysis.factor)}</dd></div>
      <div><dt className="text-ink-mute">daylight</dt><dd>{f(analysis.daylight)}</dd></div>
      <div><dt className="text-ink-mute">tungsten</dt><dd>{f(analysis.tungsten)}</dd></div>
    </dl>
  );
}
