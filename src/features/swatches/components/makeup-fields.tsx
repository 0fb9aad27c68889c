import { BLOOD_PRESETS, SKIN_PRESETS } from '../../../../shared/spectral/skin-presets';
import { PresetButtons } from '../../../components/ui/preset-buttons';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { sourceKey, sourceOfSwatch, type MakeupParams, type SurfaceSource } from '../../../lib/swatch-source';

const select = 'w-full rounded-md border border-paper-line bg-paper-raised px-2 py-1.5 text-sm';
const HEX = /^#[0-9a-f]{6}$/i;

/** The choice a surface stands for in a select: a skin preset, a swatch, or 'other' (from a stage-blood preset). */
function choiceOf(s: SurfaceSource, swatches: readonly SwatchView[]): string {
  const k = sourceKey(s);
  const p = SKIN_PRESETS.find((x) => sourceKey({ skin: x.skin }) === k);
  if (p) return `preset:${p.id}`;
  const w = swatches.find((x) => sourceKey(sourceOfSwatch(x)) === k);
  return w ? `swatch:${w.id}` : 'other';
}

function surfaceOf(choice: string, swatches: readonly SwatchView[]): SurfaceSource | null {
  const [kind, id] = choice.split(':');
  if (kind === 'preset') {
    const p = SKIN_PRESETS.find((x) => x.id === id);
    return p ? { skin: { ...p.skin } } : null;
  }
  const w = swatches.find((x) => x.id === Number(id));
  return w ? sourceOfSwatch(w) : null;
}

function SurfaceOptions({ swatches, skins = true }: { swatches: readonly SwatchView[]; skins?: boolean }) {
  return (
    <>
      {skins && <optgroup label="Skin presets">{SKIN_PRESETS.map((p) => <option key={p.id} value={`preset:${p.id}`}>{p.name}</option>)}</optgroup>}
      <optgroup label="Swatches">{swatches.map((s) => <option key={s.id} value={`swatch:${s.id}`}>{s.name}</option>)}</optgroup>
    </>
  );
}

/**
 * Makeup over skin: the base (a skin preset or any swatch), the paint (a colour or any swatch) and its
 * coverage, 0 % (bare base) to 100 % (the paint alone); stage-blood presets fill in all three.
 */
export function MakeupFields({ makeup, onChange, swatches, errors }: { makeup: MakeupParams; onChange: (m: MakeupParams) => void; swatches: readonly SwatchView[]; errors: (k: string) => string | undefined }) {
  const over = choiceOf(makeup.over, swatches);
  const paintIsColour = typeof makeup.colour === 'string';
  const paint = typeof makeup.colour === 'string' ? 'colour' : choiceOf(makeup.colour, swatches);
  const hex = typeof makeup.colour === 'string' ? makeup.colour : '#a33b4a';
  const blood = BLOOD_PRESETS.find((b) => sourceKey({ makeup: b.makeup as MakeupParams }) === sourceKey({ makeup }));
  const covErr = errors('origin.makeup.coverage');
  const colourErr = errors('origin.makeup.colour');
  return (
    <div className="grid gap-3">
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Stage blood</legend>
        <PresetButtons label="Stage blood presets" presets={BLOOD_PRESETS} chosen={blood} onPick={(b) => onChange(structuredClone(b.makeup) as MakeupParams)} />
      </fieldset>
      <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Over (the base)
        <select className={`${select} normal-case tracking-normal`} value={over} onChange={(e) => { const s = surfaceOf(e.target.value, swatches); if (s) onChange({ ...makeup, over: s }); }}>
          {over === 'other' && <option value="other">as the preset gives it</option>}
          <SurfaceOptions swatches={swatches} />
        </select>
      </label>
      <div className="grid grid-cols-[minmax(0,1fr)_auto] items-end gap-2">
        <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Paint
          <select className={`${select} normal-case tracking-normal`} value={paint} onChange={(e) => {
            if (e.target.value === 'colour') onChange({ ...makeup, colour: hex });
            else { const s = surfaceOf(e.target.value, swatches); if (s) onChange({ ...makeup, colour: s }); }
          }}>
            <option value="colour">a colour (hex or picker)</option>
            {paint === 'other' && <option value="other">as the preset gives it</option>}
            <SurfaceOptions swatches={swatches} skins={false} />
          </select>
        </label>
        {paintIsColour && (
          <div className="flex items-end gap-1">
            <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Paint hex
              <input className="w-24 rounded-md border border-paper-line bg-paper-raised px-2 py-1.5 text-sm tabular normal-case" value={hex} aria-invalid={!!colourErr}
                onChange={(e) => onChange({ ...makeup, colour: e.target.value })} />
            </label>
            <input type="color" aria-label="Paint picker" value={HEX.test(hex) ? hex : '#000000'} onChange={(e) => onChange({ ...makeup, colour: e.target.value })} className="h-9 w-12 cursor-pointer rounded border border-paper-line bg-paper-raised" />
          </div>
        )}
      </div>
      {colourErr && <p role="alert" className="text-xs text-warn">{colourErr}</p>}
      <div className="grid grid-cols-[7rem_minmax(0,1fr)_4rem] items-center gap-2">
        <label htmlFor="makeup-coverage" className="text-sm font-medium">Coverage</label>
        <input id="makeup-coverage" type="range" min={0} max={100} step={1} value={Math.round(makeup.coverage * 100)} aria-invalid={!!covErr}
          aria-valuetext={`${Math.round(makeup.coverage * 100)} %`} onChange={(e) => onChange({ ...makeup, coverage: Number(e.target.value) / 100 })} className="w-full accent-accent" />
        <output htmlFor="makeup-coverage" className="text-right text-xs tabular text-ink-soft">{Math.round(makeup.coverage * 100)} %</output>
      </div>
      {covErr && <p role="alert" className="text-xs text-warn">{covErr}</p>}
      <p className="text-xs text-ink-mute">A layer of paint over the base (Kubelka–Munk): 0 % is the bare base, 100 % the paint’s own reflectance.</p>
    </div>
  );
}
