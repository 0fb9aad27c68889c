import type { SwatchView } from '../../../../shared/schemas/swatch';

/** Whether a swatch's spectrum was measured, modelled from physics (skin, makeup) or estimated from its colour. */
export function SpectrumBadge({ s }: { s: Pick<SwatchView, 'spectrum'> }) {
  if (s.spectrum === 'measured') return <span className="rounded bg-accent-soft px-1.5 py-0.5 text-[11px] text-accent-strong">measured</span>;
  if (s.spectrum === 'modelled') return <span className="rounded border border-accent/30 px-1.5 py-0.5 text-[11px] text-accent-strong">modelled</span>;
  return <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-[11px] text-ink-mute">estimated spectrum</span>;
}
