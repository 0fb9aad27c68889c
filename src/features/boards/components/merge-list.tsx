import type { LookTones } from '../../../../shared/schemas/board';

/** The merges of one look, in words: which two swatches read as one grey, how close on the medium and how far apart to the eye. */
export function MergeList({ look, nameOf }: { look: LookTones; nameOf: (id: number) => string }) {
  if (!look.merges.length) return <p className="text-xs text-ink-mute">No merges through {look.lookName}.</p>;
  return (
    <ul className="grid gap-1 text-xs" aria-label={`Merges through ${look.lookName}`}>
      {look.merges.map((m) => (
        <li key={`${m.a}-${m.b}`} className="flex flex-wrap items-baseline gap-x-2 rounded border border-warn/40 bg-warn-soft px-2 py-1" data-testid="merge">
          <span className="font-medium text-warn">{nameOf(m.a)} ≈ {nameOf(m.b)}</span>
          <span className="tabular text-ink-soft">{m.stopsApart.toFixed(2)} st apart on the medium · ΔE₀₀ {m.deltaE.toFixed(0)} to the eye</span>
        </li>
      ))}
    </ul>
  );
}
