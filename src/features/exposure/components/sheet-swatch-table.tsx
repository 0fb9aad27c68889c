import { Fragment } from 'react';
import { NEAR_THRESHOLD_STOPS, SHEET_FLAG_WORDS, type ExposureSheet, type SheetFlag } from '../../../../shared/schemas/sheet';
import { isExact, WIDE_WIDTH, widthOf, zoneSpanWords } from '../../../lib/tone-range';

/** Inter's tabular figures also widen hyphens, so words in tables are set with normal figures. */
const WORDS = '[font-variant-numeric:normal]';
const NUM = 'px-1 text-right tabular-nums';
const FLAGS: readonly SheetFlag[] = ['lost', 'near-lost', 'blown', 'near-blown'];

const signed = (v: number) => {
  const r = Number(v.toFixed(1));
  return r === 0 ? '0.0' : `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(1)}`;
};

/** A rule across the table where a threshold falls between two rows. */
function Threshold({ children }: { children: string }) {
  return (
    <tr className="border-t-2 border-warn" data-testid="sheet-threshold">
      <td colSpan={8} className="py-0.5 text-[11px] font-semibold text-warn">{children}</td>
    </tr>
  );
}

/**
 * Every swatch of the sheet's boards, key first, then lightest to darkest: none left off; the darkest and
 * lightest flagged against the thresholds in force, with the thresholds drawn across the table.
 */
export function SheetSwatchTable({ s }: { s: ExposureSheet }) {
  const rows = s.swatches;
  const lastBlown = rows.findLastIndex((w) => !w.key && w.blown);
  const firstLost = rows.findIndex((w) => !w.key && w.lost);
  const count = (f: SheetFlag) => rows.filter((w) => w.flag === f).length;
  const tally = FLAGS.filter((f) => count(f) > 0).map((f) => `${count(f)} ${SHEET_FLAG_WORDS[f]}`);
  const th = s.thresholds;
  return (
    <section className="mb-5">
      <p className="mb-1 text-sm font-semibold" data-testid="sheet-swatch-count">
        {rows.length} swatch{rows.length === 1 ? '' : 'es'}, every one on the boards{tally.length ? `: ${tally.join(', ')}` : ''}.
      </p>
      <table className="sheet-swatches w-full text-sm">
        <thead className={`text-left text-[10px] uppercase tracking-wide text-ink-mute ${WORDS}`}>
          <tr><th>Colour · grey</th><th className="px-1">Swatch</th><th className="px-1">Board</th><th className="px-1 text-right">Zone</th><th className="px-1 text-right">Stops</th><th className="px-1">Could read</th><th className="px-1 text-right">Shift</th><th className="px-2">Note</th></tr>
        </thead>
        <tbody>
          {rows.map((w, i) => {
            const wide = widthOf(w.range.plausible) >= WIDE_WIDTH;
            const note = [w.flag ? SHEET_FLAG_WORDS[w.flag] : '', wide ? 'measure it' : ''].filter(Boolean).join('; ');
            return (
              <Fragment key={w.swatchId}>
                {i === firstLost && <Threshold>{`Shadow-detail threshold: ${th.shadowDetailStops.toFixed(1)} stops under the key. Texture is lost below this line.`}</Threshold>}
                <tr className={`border-t border-paper-line ${w.lost || w.blown ? 'bg-warn-soft' : ''}`} data-testid="sheet-swatch-row" data-flag={w.flag ?? ''}>
                  <td className="py-0.5">
                    <span className="inline-flex overflow-hidden rounded-sm border border-paper-line">
                      <span className="h-4 w-6" style={{ background: w.hex }} />
                      <span className="h-4 w-6" style={{ background: `rgb(${w.grey},${w.grey},${w.grey})` }} />
                    </span>
                  </td>
                  <td className={`px-1 ${WORDS} ${w.key ? 'font-semibold' : ''}`}>{w.name}{w.key ? ' (key)' : ''}</td>
                  <td className={`px-1 text-ink-soft ${WORDS}`}>{w.board}</td>
                  <td className={`${NUM} whitespace-nowrap`}>{w.numeral} ({w.zone.toFixed(1)})</td>
                  <td className={NUM}>{signed(w.stops)}</td>
                  <td className={`whitespace-nowrap px-1 tabular-nums ${isExact(w.range) ? 'text-ink-mute' : wide ? 'font-semibold text-warn' : 'text-ink-soft'}`} title={isExact(w.range) ? 'measured spectrum: the tone is as computed' : `plausible range ${widthOf(w.range.plausible).toFixed(1)} st wide`} data-testid="sheet-could-read">
                    {isExact(w.range) ? 'measured' : zoneSpanWords(w.range.plausible)}
                  </td>
                  <td className={`${NUM} ${Math.abs(w.shift) >= 1 ? 'text-warn' : ''}`}>{signed(w.shift)}</td>
                  <td className={`px-2 text-warn ${WORDS} ${w.lost || w.blown ? 'font-semibold' : ''}`}>{note}</td>
                </tr>
                {i === lastBlown && <Threshold>{`Highlight roll-off: ${th.highlightRollOffStops.toFixed(1)} stops over the key. Highlights blow above this line.`}</Threshold>}
              </Fragment>
            );
          })}
        </tbody>
      </table>
      <p className="mt-1 text-[11px] text-ink-mute">
        Stops from middle grey on the medium with the key placed; shift = medium minus eye (+ reads lighter than it looks).
        “Could read”: the zones a colour given only as a value could land on through this look with a realistic spectrum (the bar; the faint line is every possible spectrum); measure the swatch to be sure.
        “Near”: within {NEAR_THRESHOLD_STOPS} stop of a threshold, or could cross it.
      </p>
    </section>
  );
}
