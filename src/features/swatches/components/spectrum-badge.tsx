import type { SwatchView } from '../../../../shared/schemas/swatch';

/** Whether a swatch's spectrum was measured or estimated from its colour. */
export function SpectrumBadge({ s }: { s: Pick<SwatchView, 'spectrum'> }) {
  return s.spectrum === 'measured'
    ? <span className="rounded bg-accent-soft px-1.5 py-0.5 text-[11px] text-accent-strong">measured</span>
    : <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-[11px] text-ink-mute">estimated spectrum</span>;
}
