import { useId, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import { inkOn } from '../../../lib/tone-format';
import { keyOffset, type SourcedLook } from '../../../lib/look-sources';
import { sourceOfSwatch, type SurfaceSource } from '../../../lib/swatch-source';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { ZONE_NUMERALS, zoneFromStops, zoneNumeral } from '../../../../shared/tone/zones';
import { simulate } from '../api/simulate-zones';
import { useFindShade, type ShadeAnswer } from '../api/find-shade';

/** What keeping or replacing a shade stores: a colour, or the model's parameters for skin and makeup. */
export type ShadeOrigin =
  | { type: 'colour'; colour: { space: 'hex'; hex: string } }
  | { type: 'skin'; skin: unknown }
  | { type: 'makeup'; makeup: unknown };

/** The result of keeping a shade: the new swatch and the boards it was put on. */
export interface Kept {
  id: number;
  name: string;
  boards: { id: number; name: string; href: string }[];
}

interface Props {
  /** the swatches to choose from (one on the swatch page, the board's on a board) */
  swatches: SwatchView[];
  swatchId: number;
  looks: SourcedLook[];
  /** may add a swatch (keep as new) */
  mayKeep: boolean;
  /** may change the chosen swatch (replace its colour) */
  mayReplace: (s: SwatchView) => boolean;
  onKeep: (from: SwatchView, name: string, origin: ShadeOrigin) => Promise<Kept>;
  onReplace: (s: SwatchView, origin: ShadeOrigin) => Promise<unknown>;
  /** heading level text; the board says which swatch */
  title?: string;
}

/** The solver's parameter names in words. */
const CHANGED: Record<string, string> = { lightness: 'lightness L*', melanin: 'pigment (melanin)', coverage: 'coverage' };

const select = 'rounded-md border border-paper-line bg-paper-raised px-2 py-1.5 text-sm';

/** How far the answer could read, in zones after key, as words ('' when exact). */
function rangeWords(a: ShadeAnswer, offset: number): string {
  const r = a.range;
  const pair = Array.isArray(r) ? r : r?.plausible;
  if (!pair) return '';
  const lo = zoneNumeral(zoneFromStops(pair[0] + offset));
  const hi = zoneNumeral(zoneFromStops(pair[1] + offset));
  const w = Math.max(0, pair[1] - pair[0]);
  if (w < 0.05) return 'exact (its spectrum is known)';
  return `${lo === hi ? `zone ${lo}` : `zone ${lo} to ${hi}`} with any realistic spectrum (${w.toFixed(1)} st)`;
}

/** The origin to store for an answer: the model's parameters when `near` was skin or makeup, else the colour. */
function originOf(a: ShadeAnswer, near: SurfaceSource): ShadeOrigin {
  const p = a.source ?? a.params ?? {};
  if ('skin' in near && p.skin) return { type: 'skin', skin: p.skin };
  if ('makeup' in near && p.makeup) return { type: 'makeup', makeup: p.makeup };
  return { type: 'colour', colour: { space: 'hex', hex: a.srgb } };
}

/**
 * "Find the shade for zone …": the colour nearest a swatch (same hue; lightness and chroma moved, or the
 * model's own parameter for skin and makeup) that reads on the chosen zone through the chosen look, with
 * its range; kept as a new swatch or put in place of the swatch's colour.
 */
export function ShadeFinder({ swatches, swatchId, looks, mayKeep, mayReplace, onKeep, onReplace, title = 'Find the shade for a zone' }: Props) {
  const id = useId();
  const [chosen, setChosen] = useState(swatchId);
  const [lookId, setLookId] = useState(looks[0]?.id ?? 0);
  const [zone, setZone] = useState(4);
  const [offset, setOffset] = useState(0);
  const [name, setName] = useState('');
  const [done, setDone] = useState<{ kept?: Kept; replaced?: string } | null>(null);
  const [saving, setSaving] = useState<unknown>(null);
  const shade = useFindShade();
  const swatch = swatches.find((s) => s.id === chosen) ?? swatches[0];
  const look = looks.find((l) => l.id === lookId) ?? looks[0];
  if (!swatch || !look) return null;
  const near = sourceOfSwatch(swatch);
  const answer = shade.data;

  async function find(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    setSaving(null);
    let off = keyOffset(look.key, null);
    if (look.key.surface) {
      const r = await simulate({ ...look.sources, swatches: [{ name: 'key', ...look.key.surface }] }).catch(() => null);
      off = keyOffset(look.key, r?.swatches[0]?.stops ?? null);
    }
    setOffset(off);
    // the target as the solver takes it: before key placement (zone = 5 + stops on /api/simulate's scale)
    const target = Math.abs(off) < 1e-9 ? { zone } : { stops: zone - 5 - off };
    shade.mutate(
      { ...look.sources, target, near: 'srgb' in near ? near.srgb : near },
      { onSuccess: () => setName(`${swatch.name}, zone ${ZONE_NUMERALS[zone]} through ${look.name}`.slice(0, 120)) },
    );
  }

  async function act(what: 'keep' | 'replace') {
    if (!answer) return;
    setSaving(null);
    try {
      const origin = originOf(answer, near);
      if (what === 'keep') setDone({ kept: await onKeep(swatch, name.trim() || swatch.name, origin) });
      else {
        await onReplace(swatch, origin);
        setDone({ replaced: swatch.name });
      }
    } catch (err) {
      setSaving(err);
    }
  }

  const after = answer ? zoneFromStops(answer.stops + offset) : 0;
  const numeral = answer ? zoneNumeral(after) : '';
  const rounded = Math.min(10, Math.max(0, Math.round(after)));
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-md border border-paper-line bg-paper px-3 py-3" data-testid="shade-finder">
      <h3 id={`${id}-h`} className="mb-2 text-sm font-semibold">{title}</h3>
      <form onSubmit={find} className="flex flex-wrap items-end gap-2" aria-label="Find the shade">
        {swatches.length > 1 && (
          <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Swatch
            <select className={select} value={swatch.id} onChange={(e) => { setChosen(Number(e.target.value)); shade.reset(); setDone(null); }}>
              {swatches.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
            </select>
          </label>
        )}
        <label className="flex min-w-0 flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Through look
          <select className={`${select} max-w-72`} value={look.id} onChange={(e) => { setLookId(Number(e.target.value)); shade.reset(); setDone(null); }}>
            {looks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Zone
          <select className={`${select} tabular`} value={zone} onChange={(e) => { setZone(Number(e.target.value)); shade.reset(); setDone(null); }}>
            {ZONE_NUMERALS.map((n, z) => <option key={n} value={z}>{n}</option>)}
          </select>
        </label>
        <Button type="submit" variant="primary" disabled={shade.isPending}>{shade.isPending ? 'Finding…' : 'Find the shade'}</Button>
      </form>
      <p className="mt-1 text-[11px] text-ink-mute">Keeps the hue of {swatch.name}; moves its lightness and chroma{'skin' in near || 'makeup' in near ? ' (for skin and makeup, the model’s own parameter)' : ''} until it reads on that zone through the look, its key placed as on the board.</p>
      <ErrorMessage error={shade.error} />
      {answer && (
        <div className="mt-3 grid gap-2" data-testid="shade-result" data-zone={numeral}>
          <div className="flex items-stretch gap-3">
            <figure className="flex h-16 w-40 shrink-0 overflow-hidden rounded-md border border-paper-line" aria-label={`The shade ${answer.srgb}: zone ${numeral} through ${look.name}`}>
              <div className="flex flex-1 items-end p-1" style={{ background: answer.srgb }}><span className="text-[10px]" style={{ color: inkOn(parseInt(answer.srgb.slice(1, 3), 16) * 0.3 + parseInt(answer.srgb.slice(3, 5), 16) * 0.6 + parseInt(answer.srgb.slice(5, 7), 16) * 0.1) }}>eye</span></div>
              <div className="flex flex-1 items-center justify-center" style={{ background: `var(--zone-${rounded})` }}>
                <span className="text-lg font-semibold tabular" style={{ color: rounded < 6 ? '#fff' : '#1b1a18' }}>{numeral}</span>
              </div>
            </figure>
            <div className="min-w-0 text-sm">
              <p><span className="font-medium tabular">{answer.srgb}</span> reads <strong>zone {numeral}</strong> <span className="text-ink-mute tabular">({after.toFixed(1)})</span> through {look.name}.</p>
              {rangeWords(answer, offset) && <p className="text-xs text-ink-soft">Could read {rangeWords(answer, offset)}.</p>}
              {answer.changed && answer.value !== undefined && <p className="text-xs text-ink-soft">Moved: {CHANGED[answer.changed] ?? answer.changed} <span className="tabular">{answer.changed === 'lightness' ? answer.value.toFixed(1) : answer.changed === 'coverage' ? `${(answer.value * 100).toFixed(0)} %` : `${(answer.value * 100).toFixed(1)} %`}</span>.</p>}
              {!answer.reached && <p className="text-xs font-medium text-warn">Zone {ZONE_NUMERALS[zone]} is out of reach from this colour through this look: this is the closest.{answer.message ? ` ${answer.message}` : ''}</p>}
              <p className="text-xs text-ink-mute">Was {swatch.hex}<span className="ml-1 inline-block h-2.5 w-5 rounded-sm border border-paper-line align-middle" style={{ background: swatch.hex }} /></p>
            </div>
          </div>
          {(mayKeep || mayReplace(swatch)) && !done && (
            <div className="flex flex-wrap items-end gap-2">
              {mayKeep && (
                <label className="flex min-w-60 flex-1 flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Name of the new swatch
                  <input className={`${select} normal-case tracking-normal`} value={name} onChange={(e) => setName(e.target.value)} />
                </label>
              )}
              {mayKeep && <Button variant="primary" onClick={() => act('keep')}>Keep as new swatch</Button>}
              {mayReplace(swatch) && <Button onClick={() => act('replace')}>Replace this one’s colour</Button>}
            </div>
          )}
          <ErrorMessage error={saving} />
          {done?.kept && (
            <p role="status" className="text-sm">
              Kept as <strong>{done.kept.name}</strong>{done.kept.boards.length > 0 && <> on {done.kept.boards.map((b, i) => <span key={b.id}>{i > 0 && ', '}<Link className="text-accent underline" to={b.href}>{b.name}</Link></span>)}</>}.
            </p>
          )}
          {done?.replaced && <p role="status" className="text-sm">{done.replaced} now has this colour.</p>}
        </div>
      )}
    </section>
  );
}
