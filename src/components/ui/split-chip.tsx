import type { SwatchTone } from '../../../shared/schemas/board';
import { greyCss, hexLightness, inkOn, signedStops } from '../../lib/tone-format';
import { isExact, rangeLabel, WIDE_WIDTH, widthOf, zoneSpanWords } from '../../lib/tone-range';
import { RangeBar } from './range-bar';

interface Props {
  name: string;
  hex: string;
  tone: SwatchTone;
  /** names of the swatches this one merges with on this look, whatever their spectra */
  mergesWith?: string[];
  /** names of the swatches it may merge with (some plausible spectra would merge them) */
  mayMergeWith?: string[];
  /** how many more it merges / may merge with than are named (the server names a few per swatch) */
  moreMerges?: number;
  moreMayMerge?: number;
  estimated?: boolean;
  size?: 'md' | 'sm';
}

/** A swatch as a split chip: its colour to the eye beside its simulated grey, with zone, stops and shift. */
/** Names, then "and N more" when more are counted than named. */
const namesAndMore = (names: string[], more = 0) => `${names.join(', ')}${more > 0 ? ` and ${more} more` : ''}`;

export function SplitChip({ name, hex, tone, mergesWith = [], mayMergeWith = [], moreMerges = 0, moreMayMerge = 0, estimated, size = 'md' }: Props) {
  const merged = mergesWith.length > 0;
  const mayMerge = !merged && mayMergeWith.length > 0;
  const h = size === 'md' ? 'h-16' : 'h-11';
  const exact = isExact(tone.range);
  const wide = widthOf(tone.range.plausible) >= WIDE_WIDTH;
  const label = `${name}: zone ${tone.numeral}, ${signedStops(tone.stops)} from middle grey, shift ${signedStops(tone.shift)}, ${rangeLabel(tone.range)}${merged ? `, merges with ${namesAndMore(mergesWith, moreMerges)}` : ''}${mayMergeWith.length ? `, may merge with ${namesAndMore(mayMergeWith, moreMayMerge)}` : ''}${tone.lost ? ', shadow detail lost' : ''}${tone.blown ? ', highlight blown' : ''}`;
  return (
    <figure
      className={`overflow-hidden rounded-md border bg-paper-raised ${merged ? 'border-warn ring-2 ring-warn/40' : mayMerge ? 'border-dashed border-warn/60' : 'border-paper-line'}`}
      aria-label={label}
      data-testid="split-chip"
      data-zone={tone.numeral}
      data-merge={merged ? 'certain' : mayMerge ? 'possible' : undefined}
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
        <div className="mt-1 flex items-center gap-1.5">
          <RangeBar range={tone.range} stops={tone.stops} className="flex-1" />
          <span className={`shrink-0 text-[10px] tabular ${exact ? 'text-accent' : wide ? 'font-semibold text-warn' : 'text-ink-mute'}`} title={exact ? 'measured spectrum: the tone is as computed' : `could read zone ${zoneSpanWords(tone.range.plausible)}, ${widthOf(tone.range.plausible).toFixed(1)} st wide`}>
            {exact ? 'measured' : zoneSpanWords(tone.range.plausible)}
          </span>
        </div>
        {(merged || mayMergeWith.length > 0 || tone.lost || tone.blown || estimated) && (
          <div className="mt-0.5 flex flex-wrap gap-1 text-[10px]">
            {merged && <span className="rounded bg-warn-soft px-1 text-warn">merges with {namesAndMore(mergesWith, moreMerges)}</span>}
            {mayMergeWith.length > 0 && <span className="rounded border border-dashed border-warn/50 px-1 text-warn/90">may merge with {namesAndMore(mayMergeWith, moreMayMerge)}</span>}
            {tone.lost && <span className="rounded bg-warn-soft px-1 text-warn">detail lost</span>}
            {tone.blown && <span className="rounded bg-warn-soft px-1 text-warn">blown</span>}
            {estimated && <span className="rounded bg-paper-sunk px-1 text-ink-mute">estimated spectrum</span>}
          </div>
        )}
      </figcaption>
    </figure>
  );
}
