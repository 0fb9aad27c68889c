import type { SwatchTone } from '../../../shared/schemas/board';
import { greyCss, hexLightness, inkOn, signedStops } from '../../lib/tone-format';

interface Props {
  name: string;
  hex: string;
  tone: SwatchTone;
  /** names of the swatches this one merges with on this look */
  mergesWith?: string[];
  estimated?: boolean;
  size?: 'md' | 'sm';
}

/** A swatch as a split chip: its colour to the eye beside its simulated grey, with zone, stops and shift. */
export function SplitChip({ name, hex, tone, mergesWith = [], estimated, size = 'md' }: Props) {
  const merged = mergesWith.length > 0;
  const h = size === 'md' ? 'h-16' : 'h-11';
  const label = `${name}: zone ${tone.numeral}, ${signedStops(tone.stops)} from middle grey, shift ${signedStops(tone.shift)}${merged ? `, merges with ${mergesWith.join(', ')}` : ''}${tone.lost ? ', shadow detail lost' : ''}${tone.blown ? ', highlight blown' : ''}`;
  return (
    <figure
      className={`overflow-hidden rounded-md border bg-paper-raised ${merged ? 'border-warn ring-2 ring-warn/40' : 'border-paper-line'}`}
      aria-label={label}
      data-testid="split-chip"
      data-zone={tone.numeral}
    >
      <div className={`flex ${h}`}>
        <div className="flex flex-1 items-end p-1" style={{ background: hex }} title={`${hex} to the eye`}>
          <span className="text-[10px] tabular" style={{ color: hexLightness(hex) > 140 ? '#1b1a18' : '#fff' }}>eye</span>
        </div>
        <div className="flex flex-1 items-center justify-center" style={{ background: greyCss(tone.grey) }} title={`simulated grey ${Math.round(tone.grey)}/255`}>
          <span className="text-lg font-semibold tabular" style={{ color: inkOn(tone.grey) }}>{tone.numeral}</span>
        </div>
      </div>
      <figcaption className="px-2 py-1 text-xs">
        <div className="truncate font-medium" title={name}>{name}</div>
        <div className="flex justify-between gap-1 tabular text-ink-soft">
          <span title="stops from middle grey on the medium">{signedStops(tone.stops)}</span>
          <span title="shift: tone on the medium minus tone to the eye" className={Math.abs(tone.shift) >= 1 ? 'font-semibold text-ink' : ''}>
            shift {signedStops(tone.shift)}
          </span>
        </div>
        {(merged || tone.lost || tone.blown || estimated) && (
          <div className="mt-0.5 flex flex-wrap gap-1 text-[10px]">
            {merged && <span className="rounded bg-warn-soft px-1 text-warn">merges with {mergesWith.join(', ')}</span>}
            {tone.lost && <span className="rounded bg-warn-soft px-1 text-warn">detail lost</span>}
            {tone.blown && <span className="rounded bg-warn-soft px-1 text-warn">blown</span>}
            {estimated && <span className="rounded bg-paper-sunk px-1 text-ink-mute">estimated spectrum</span>}
          </div>
        )}
      </figcaption>
    </figure>
  );
}
