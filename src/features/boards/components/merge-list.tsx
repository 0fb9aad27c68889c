import { useState } from 'react';
import type { LookTones } from '../../../../shared/schemas/board';
import { mergePairs } from '../lib/board-rows';

/** Possible merges shown before the rest fold away. */
const POSSIBLE_SHOWN = 4;

/**
 * The merges of one look, in words: which two swatches read as one grey, how close on the medium and how far
 * apart to the eye. Those that merge whatever their spectra come first ("merges"); those only some plausible
 * spectra would merge follow in a lighter warning ("may merge"), the rest folded behind a button. The counts
 * are the server's (every pair); the pairs listed are those its per-swatch partner lists name.
 */
export function MergeList({ look, nameOf }: { look: LookTones; nameOf: (id: number) => string }) {
  const [all, setAll] = useState(false);
  if (!look.mergeCount) return <p className="text-xs text-ink-mute">No merges through {look.lookName}.</p>;
  const sorted = mergePairs(look);
  const certain = sorted.filter((m) => m.certainty === 'certain');
  const possible = sorted.filter((m) => m.certainty !== 'certain');
  const shown = all ? possible : possible.slice(0, POSSIBLE_SHOWN);
  const certainCount = look.certainMergeCount;
  const possibleCount = look.mergeCount - look.certainMergeCount;
  const unlisted = look.mergeCount - sorted.length;
  return (
    <div className="grid gap-1 text-xs">
      <p className="text-ink-mute tabular">
        {certainCount > 0 ? <span className="font-semibold text-warn">{certainCount} certain merge{certainCount > 1 ? 's' : ''}</span> : 'No certain merges'}
        {possibleCount > 0 && <> · <span className="text-warn/80">{possibleCount} possible</span>: measure the swatches to be sure</>}
      </p>
      <ul className="grid gap-1" aria-label={`Merges through ${look.lookName}`}>
        {[...certain, ...shown].map((m) => {
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
      {possible.length > POSSIBLE_SHOWN && (
        <button type="button" className="justify-self-start rounded px-1 text-accent underline hover:text-accent-strong" aria-expanded={all} onClick={() => setAll((x) => !x)}>
          {all ? 'Show fewer' : `Show ${possible.length - POSSIBLE_SHOWN} more that may merge`}
        </button>
      )}
      {unlisted > 0 && (all || possible.length <= POSSIBLE_SHOWN) && (
        <p className="text-ink-mute" data-testid="merges-unlisted">and {unlisted} more pair{unlisted > 1 ? 's' : ''}, not listed: each swatch's chip names its nearest</p>
      )}
    </div>
  );
}
