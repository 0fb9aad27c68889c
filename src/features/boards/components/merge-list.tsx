import { useState } from 'react';
import type { LookTones } from '../../../../shared/schemas/board';
import { mergePairs } from '../lib/board-rows';

/** Possible merges shown before the rest fold away (after every certain one, up to CERTAIN_SHOWN). */
const POSSIBLE_SHOWN = 4;
/** Certain merges shown at first: a long board can list thousands, which the page would lay out each time. */
const CERTAIN_SHOWN = 12;
/** More merges per press of the button. */
const MORE_PER_PRESS = 50;

/**
 * The merges of one look, in words: which two swatches read as one grey, how close on the medium and how far
 * apart to the eye. Those that merge whatever their spectra come first ("merges"); those only some plausible
 * spectra would merge follow in a lighter warning ("may merge"); past the first dozen or so the rest fold
 * behind a button that shows fifty more at a time (a long board lists thousands). The counts
 * are the server's (every pair); the pairs listed are those its per-swatch partner lists name.
 */
export function MergeList({ look, nameOf }: { look: LookTones; nameOf: (id: number) => string }) {
  const [presses, setPresses] = useState(0);
  if (!look.mergeCount) return <p className="text-xs text-ink-mute">No merges through {look.lookName}.</p>;
  const sorted = mergePairs(look); // certain ones first
  const certain = sorted.filter((m) => m.certainty === 'certain');
  const first = certain.length <= CERTAIN_SHOWN ? certain.length + Math.min(POSSIBLE_SHOWN, sorted.length - certain.length) : CERTAIN_SHOWN;
  const shown = sorted.slice(0, first + presses * MORE_PER_PRESS);
  const hidden = sorted.length - shown.length;
  const hiddenPossibleOnly = shown.length >= certain.length;
  const certainCount = look.certainMergeCount;
  const possibleCount = look.mergeCount - look.certainMergeCount;
  const unlisted = look.mergeCount - sorted.length;
  return (
    <div className="grid gap-1 text-xs">
      <p className="text-ink-mute tabular">
        {certainCount > 0 ? <span className="font-semibold text-warn">{certainCount.toLocaleString('en')} certain merge{certainCount > 1 ? 's' : ''}</span> : 'No certain merges'}
        {possibleCount > 0 && <> · <span className="text-warn/80">{possibleCount.toLocaleString('en')} possible</span>: measure the swatches to be sure</>}
      </p>
      <ul className="grid gap-1" aria-label={`Merges through ${look.lookName}`}>
        {shown.map((m) => {
          const sure = m.certainty === 'certain';
          return (
            <li key={`${m.a}-${m.b}`} className={`flex flex-wrap items-baseline gap-x-2 rounded px-2 py-1 ${sure ? 'border border-warn/40 bg-warn-soft' : 'border border-dashed border-warn/35 bg-paper-raised'}`} data-testid="merge" data-certainty={m.certainty}>
              <span className={`rounded px-1 text-[10px] font-semibold uppercase tracking-wide ${sure ? 'bg-warn text-white' : 'border border-warn/50 text-warn/90'}`}>{sure ? 'merges' : 'may merge'}</span>
              <span className={`font-medium ${sure ? 'text-warn' : 'text-ink-soft'}`}>{nameOf(m.a)} ≈ {nameOf(m.b)}</span>
              <span className="tabular text-ink-mute">{m.stopsApart.toFixed(2)} st apart on the medium · ΔE₀₀ {m.deltaE.toFixed(0)} to the eye</span>
            </li>
          );
        })}
      </ul>
      {(hidden > 0 || presses > 0) && (
        <div className="flex gap-3">
          {hidden > 0 && (
            <button type="button" className="rounded px-1 text-accent underline hover:text-accent-strong" onClick={() => setPresses((x) => x + 1)}>
              {`Show ${Math.min(hidden, MORE_PER_PRESS)} more${hiddenPossibleOnly ? ' that may merge' : ''}`}{hidden > MORE_PER_PRESS && ` (of ${hidden.toLocaleString('en')})`}
            </button>
          )}
          {presses > 0 && (
            <button type="button" className="rounded px-1 text-accent underline hover:text-accent-strong" onClick={() => setPresses(0)}>
              Show fewer
            </button>
          )}
        </div>
      )}
      {unlisted > 0 && hidden === 0 && (
        <p className="text-ink-mute" data-testid="merges-unlisted">and {unlisted.toLocaleString('en')} more pair{unlisted > 1 ? 's' : ''}, not listed: each swatch's chip names its nearest</p>
      )}
    </div>
  );
}
