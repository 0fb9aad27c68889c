import { useMemo } from 'react';
import { CharacteristicCurveChart, type CurveSwatch } from './characteristic-curve-chart';
import { SheetLightBudget } from './sheet-light-budget';
import { formatEI, formatFactor, formatFootcandles, formatLux, formatSeconds, formatStopsLabel, formatTStop } from '../../../../shared/tone/exposure-format';
import type { ExposureSheet, SheetSwatch } from '../../../../shared/schemas/sheet';
import { ZONE_NUMERALS, zoneFromStops } from '../../../../shared/tone/zones';
import { zoneFrac } from '../../../components/ui/range-bar';
import { isExact, zoneSpanWords } from '../../../lib/tone-range';
import { SheetSwatchTable } from './sheet-swatch-table';

/** Inter's tabular figures also widen hyphens, so words in tables are set with normal figures. */
const WORDS = '[font-variant-numeric:normal]';
const NUM = 'px-1 text-right tabular-nums';

const pct = (f: number) => `${(f * 100).toFixed(2)}%`;
const spanOf = (r: readonly [number, number]) => {
  const lo = zoneFrac(zoneFromStops(r[0]));
  return { left: pct(lo), width: pct(Math.max(0, zoneFrac(zoneFromStops(r[1])) - lo)) };
};

/**
 * The sheet's zone ruler (as on its PDF): the ramp 0..X with every swatch's plausible range as a bar, every
 * possible spectrum as a fainter line, and the computed tone as a mark (warning colour when lost or blown).
 */
function SheetZoneRuler({ swatches }: { swatches: SheetSwatch[] }) {
  return (
    <div className="mt-3" role="img" aria-label={`Zone ruler: ${swatches.map((w) => `${w.name} zone ${w.numeral}${isExact(w.range) ? '' : `, could read ${zoneSpanWords(w.range.plausible)}`}`).join('; ')}`} data-testid="sheet-zone-ruler">
      <div className="flex overflow-hidden rounded-sm border border-paper-line">
        {ZONE_NUMERALS.map((n, z) => (
          <span key={n} className={`flex-1 py-px text-center text-[9px] font-semibold ${z < 6 ? 'text-white' : 'text-ink'}`} style={{ background: `var(--zone-${z})` }}>{n}</span>
        ))}
      </div>
      <div className="relative h-5">
        {swatches.map((w) => !isExact(w.range) && (
          <span key={`r${w.swatchId}`}>
            <span className="absolute top-[10px] h-px bg-ink-mute/40" style={spanOf(w.range.possible)} />
            <span className="absolute top-[9px] h-[3px] bg-ink-soft/45" style={spanOf(w.range.plausible)} />
          </span>
        ))}
        {swatches.map((w) => (
          <span key={`m${w.swatchId}`} className={`absolute top-px h-0 w-0 -translate-x-1/2 border-x-[3px] border-b-[5px] border-x-transparent ${w.lost || w.blown ? 'border-b-warn' : 'border-b-ink'}`} style={{ left: pct(zoneFrac(w.zone)) }} />
        ))}
      </div>
    </div>
  );
}

function H({ children }: { children: string }) {
  return <h2 className="mb-2 text-[11px] font-semibold uppercase tracking-widest text-accent">{children}</h2>;
}

/** The exposure sheet's content: the same as its PDF, laid out for screen and A4. */
export function ExposureSheetView({ s }: { s: ExposureSheet }) {
  const pins: CurveSwatch[] = useMemo(() => s.swatches.map((w) => ({ name: w.name, stops: w.stops, colour: w.hex })), [s.swatches]);
  const settings = useMemo(() => s.tone, [s.tone]);
  const p = s.lightPath;
  const path = [
    ['Light', p.light],
    ['Filters', p.filters.length ? p.filters.map((f) => `${f.label}, on the ${f.on}`).join('; ') : 'none'],
    ['Medium', p.medium],
    ['Development', p.development],
    ['Print', p.print],
  ];
  return (
    <article className="rounded-lg border border-paper-line bg-white p-6 print:border-0 print:p-0" aria-label="Exposure sheet">
      <header className="mb-4 border-b-2 border-ink pb-3">
        <div className="flex justify-between text-[11px]">
          <span className="font-semibold uppercase tracking-widest text-accent">Exposure sheet</span>
          <span className="text-ink-mute">Grisaille · {new Date(s.generatedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</span>
        </div>
        <h1 className={`mt-1 text-3xl ${WORDS}`}>{s.look.name}</h1>
        <p className="text-sm text-ink-soft">{s.production.name}</p>
      </header>

      <section className="mb-5">
        <H>Light path</H>
        <ol className="flex items-stretch gap-1 text-sm" aria-label="Light path">
          {path.map(([k, v], i) => (
            <li key={k} className="flex flex-1 items-center gap-1">
              <div className={`h-full flex-1 rounded border border-paper-line p-2 ${k === 'Medium' ? 'bg-paper-sunk' : ''}`}>
                <div className="text-[10px] font-semibold uppercase tracking-wide text-ink-mute">{k}</div>
                <div>{v}</div>
              </div>
              {i < path.length - 1 && <span aria-hidden="true" className="text-ink-mute">→</span>}
            </li>
          ))}
        </ol>
      </section>

      <div className="mb-5 grid grid-cols-2 gap-6">
        <section>
          <H>Filter factors</H>
          <table className="w-full text-sm">
            <thead className={`text-left text-[10px] uppercase tracking-wide text-ink-mute ${WORDS}`}><tr><th>Light</th><th className="px-1 text-right">Stops</th><th className="px-1 text-right">Factor</th></tr></thead>
            <tbody>
              {s.factors.map((f) => (
                <tr key={f.label} className="border-t border-paper-line">
                  <td className={`py-1 ${WORDS}`}>{f.label}<span className="block text-xs text-ink-mute">{f.light}</span></td>
                  <td className={`${NUM} ${f.opaque ? 'text-warn' : ''}`}>{f.opaque ? 'opaque' : formatStopsLabel(f.stops)}</td>
                  <td className={NUM}>{formatFactor(f.factor)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-1 text-[11px] text-ink-mute">F = ΣE·S / ΣE·T·S over 350–900 nm on this medium; stops = log₂ F. Open up by this much.</p>
        </section>
        <section data-testid="sheet-ei-chain">
          <H>Exposure-index chain</H>
          {s.chain ? (
            <>
              <table className="w-full text-sm">
                <thead className={`text-left text-[10px] uppercase tracking-wide text-ink-mute ${WORDS}`}><tr><th>Step</th><th className="px-1 text-right">Change</th><th className="px-1 text-right">EI</th></tr></thead>
                <tbody>
                  {s.chain.steps.map((st) => (
                    <tr key={st.step} className="border-t border-paper-line">
                      <td className={`py-1 ${WORDS}`}>{st.label}</td>
                      <td className={NUM}>{st.step === 'box' ? '' : formatStopsLabel(st.stops)}</td>
                      <td className={NUM}>{formatEI(st.ei)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="mt-2 flex items-baseline justify-between rounded bg-ink px-3 py-1.5 text-white">
                <span className="text-sm">Effective EI (this look’s light)</span>
                <span className="text-2xl font-semibold">{s.chain.effectiveEI}</span>
              </p>
              <p className="mt-1 text-xs text-ink-soft">Effective EI under {s.chain.byLight.map((b) => `${b.light}: ${formatEI(b.effectiveEI)}`).join('; under ')}. Each EI rounded to the ISO third-stop series.</p>
            </>
          ) : <p className="text-sm text-ink-mute">The eye has no exposure index.</p>}
        </section>
      </div>

      <section className="mb-5" data-testid="sheet-light-levels">
        <H>Light levels (incident, at the subject)</H>
        <p className="mb-1 text-xs text-ink-soft">
          {s.camera.fps} fps, {s.camera.shutterAngle}° shutter ({formatSeconds(s.camera.exposureSeconds)}){s.chain ? `, ${formatEI(s.chain.effectiveEI)}` : ''}. E = C·N² / (t·S) after ISO 2720, meter constant C = {s.camera.calibrationConstant} lux·s.
        </p>
        {s.lightLevels.length > 0 && (
          <table className="w-full text-sm">
            <thead className={`text-left text-[10px] uppercase tracking-wide text-ink-mute ${WORDS}`}><tr><th>T-stop</th><th className="px-1 text-right">Foot-candles</th><th className="px-1 text-right">Lux</th><th className="px-1 text-right">Unfiltered, fc</th></tr></thead>
            <tbody>
              {s.lightLevels.map((r) => {
                const own = Math.abs(r.tStop - s.camera.tStop) < 1e-9;
                return (
                  <tr key={r.tStop} className={`border-t border-paper-line ${own ? 'bg-paper-sunk font-semibold' : ''}`}>
                    <td className="py-0.5">{formatTStop(r.tStop)}{own ? ' (this look)' : ''}</td>
                    <td className={NUM}>{formatFootcandles(r.footcandles)}</td>
                    <td className={NUM}>{formatLux(r.lux)}</td>
                    <td className={`${NUM} text-ink-mute`}>{formatFootcandles(r.unfilteredFootcandles)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
        {s.cost && (
          <p className={`mt-2 rounded px-3 py-1.5 text-sm font-semibold ${s.cost.ratio > 1.005 ? 'bg-warn-soft' : 'bg-paper-sunk'}`}>
            This look {s.cost.text}{s.cost.ratio > 1.005 ? ` (${formatStopsLabel(s.cost.stops)} more light)` : ''}.
          </p>
        )}
      </section>
      <SheetLightBudget s={s} />

      <section className="mb-5">
        <H>Key and zones</H>
        <p className="mb-2 text-xs text-ink-soft">
          Key: {s.key.description}. Texture is lost under {s.thresholds.shadowDetailStops.toFixed(1)} stops below the key and blows over {s.thresholds.highlightRollOffStops.toFixed(1)} stops above it.
          {s.boards.length > 0 && ` Swatches from: ${s.boards.join(', ')}.`}
        </p>
        <CharacteristicCurveChart mediumId={s.toneMediumId} settings={settings} boxSpeed={s.tone.boxSpeed ?? undefined} swatches={pins} height={240} maxLabels={0} showList={false} />
        {s.swatches.length > 0 && <SheetZoneRuler swatches={s.swatches} />}
      </section>

      {s.swatches.length > 0 ? <SheetSwatchTable s={s} /> : (
        <p className="mb-5 text-sm text-ink-mute" data-testid="sheet-no-swatches">
          {s.boardsPicked ? 'The boards picked hold no swatches.' : 'No board shows this look yet: pick boards above, or add the look to a board, to list its swatches here.'}
        </p>
      )}

      {s.notes.trim() && (
        <section className="mb-5">
          <H>Notes</H>
          <p className="whitespace-pre-line text-sm">{s.notes}</p>
        </section>
      )}

      <section className="rounded border-2 border-warn bg-warn-soft p-3" data-testid="sheet-cautions">
        <h2 className="mb-1 text-[11px] font-semibold uppercase tracking-widest text-warn">Cautions</h2>
        <ul className="space-y-1 text-sm">
          {s.cautions.map((c) => <li key={c.title}><strong>{c.title}.</strong> {c.text}</li>)}
        </ul>
      </section>
      <p className="mt-3 text-[11px] text-ink-mute">Model values: confirm with a meter and camera tests.</p>
    </article>
  );
}
