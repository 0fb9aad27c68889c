import type { LookTones } from '../../../../shared/schemas/board';
import { zoneFromStops, zoneNumeral } from '../../../../shared/tone/zones';
import { isExact, WIDE_WIDTH, widthOf } from '../../../lib/tone-range';

/** A possible range at least this wide, stops, is worth a sentence of its own. */
const WIDE_POSSIBLE = 1;

const zoneOf = (stops: number) => zoneNumeral(zoneFromStops(stops));

/** One look's range in words: where an estimated swatch could read, and where any spectrum could put it. */
function LookSentence({ look }: { look: LookTones }) {
  const t = look.tones[0];
  const [plo, phi] = t.range.plausible.map(zoneOf);
  const [qlo, qhi] = t.range.possible.map(zoneOf);
  const w = widthOf(t.range.plausible);
  const name = <em className="font-medium not-italic text-ink">{look.lookName}</em>;
  const possibleWide = widthOf(t.range.possible) >= WIDE_POSSIBLE && (qlo !== plo || qhi !== phi);
  return (
    <li className="text-sm" data-testid="tone-sureness">
      {plo === phi ? (
        <>Reads zone {plo} through {name} with any realistic spectrum <span className="text-ink-mute tabular">(plausible range {w.toFixed(1)} st)</span>.</>
      ) : (
        <>
          <span className={w >= WIDE_WIDTH ? 'font-medium text-warn' : ''}>Could read anywhere from zone {plo} to {phi}</span> through {name}{' '}
          <span className="text-ink-mute tabular">(plausible range {w.toFixed(1)} st)</span>; measure it to be sure.
        </>
      )}
      {possibleWide && <> Any spectrum with this colour could put it from zone {qlo} to {qhi} <span className="text-ink-mute tabular">({widthOf(t.range.possible).toFixed(1)} st)</span>.</>}
    </li>
  );
}

/**
 * How sure the swatch's grey is through each look, in words: for a measured spectrum, that the tone is as
 * computed; for an estimated one, the zones it could read through each look and what any spectrum could do.
 */
export function ToneSureness({ looks, measured }: { looks: LookTones[]; measured: boolean }) {
  if (!looks.length) return null;
  const exact = measured || looks.every((l) => l.tones[0] && isExact(l.tones[0].range));
  return (
    <section className="mt-3 rounded-md border border-paper-line bg-paper px-3 py-2" aria-labelledby="tone-sureness">
      <h4 id="tone-sureness" className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-mute">How sure</h4>
      {exact ? (
        <p className="text-sm" data-testid="tone-sureness">The spectrum is measured, so each tone is as computed: no range to allow for.</p>
      ) : (
        <>
          <ul className="grid gap-1">{looks.filter((l) => l.tones[0]).map((l) => <LookSentence key={l.lookId} look={l} />)}</ul>
          <p className="mt-1 text-[11px] text-ink-mute">A colour value fixes how the eye sees it, not its spectrum. The bar under each chip is the realistic range; the faint line behind it, every spectrum with this colour.</p>
        </>
      )}
    </section>
  );
}
