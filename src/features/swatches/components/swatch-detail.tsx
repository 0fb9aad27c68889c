import type { ReactNode } from 'react';
import { Spinner } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { SplitChip } from '../../../components/ui/split-chip';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { useSwatchTones } from '../api/get-swatch-tones';
import { SpectrumBadge } from './spectrum-badge';
import { SpectrumLine } from './spectrum-line';
import { ToneSureness } from './tone-sureness';
import { Button } from '../../../components/ui/button';
import { lightStopsOf, originOf } from '../../../lib/swatch-source';
import { lightWords } from './light-stops-field';

/** A physical swatch's parameters in one line: "melanin 4.0 %, blood 2.4 %, oxygen 75 %" or "60 % of … over …". */
function paramsLine(sel: SwatchView): string | null {
  const o = originOf(sel);
  const pc = (v: number) => `${(v * 100).toFixed(v * 100 < 10 ? 1 : 0)} %`;
  if (o.type === 'skin' && o.skin) {
    const k = o.skin;
    return [`melanin ${pc(k.melanin)}`, `blood ${pc(k.blood)}`, `oxygen ${pc(k.oxygenation)}`, k.bilirubin ? `bilirubin ${k.bilirubin.toFixed(0)} µmol/L` : '', k.carotene ? `carotene ${k.carotene.toFixed(0)} µmol/L` : ''].filter(Boolean).join(', ');
  }
  if (o.type === 'makeup' && o.makeup) {
    const m = o.makeup;
    const paint = typeof m.colour === 'string' ? m.colour : 'skin' in m.colour ? 'a skin' : 'a surface';
    return `${paint} at ${pc(m.coverage)} coverage over ${'skin' in m.over ? 'skin' : 'a surface'}`;
  }
  return null;
}

const SPECTRUM_WORDS: Record<SwatchView['spectrum'], string> = {
  measured: 'Measured reflectance (350–900 nm; beyond the measurement its end values are held).',
  modelled: 'Modelled reflectance: skin from melanin and blood (haemoglobin bands included), or a layer of paint over a base.',
  estimated: 'Estimated reflectance: a smooth spectrum that gives this colour in daylight (D65). A measurement would be better.',
};

/** One swatch: its colour, reflectance, and its tone through each look; `children` below (e.g. putting it on a board). */
export function SwatchDetail({ pid, swatch: sel, children, mayChange, mayDuplicate, onEdit, onDuplicate, duplicating }: {
  pid: number;
  swatch: SwatchView;
  children?: ReactNode;
  /** may edit (contributors only for their own department) */
  mayChange?: boolean;
  mayDuplicate?: boolean;
  onEdit?: () => void;
  onDuplicate?: () => void;
  duplicating?: boolean;
}) {
  const tones = useSwatchTones(pid, sel.id);
  const params = paramsLine(sel);
  const light = lightStopsOf(sel);
  return (
    <Card aria-label={`Swatch ${sel.name}`}>
      <div className="mb-2 flex items-start justify-between gap-2">
        <div>
          <h2>{sel.name}</h2>
          <p className="text-xs text-ink-mute">{sel.department} · {sel.hex} · <SpectrumBadge s={sel} /></p>
          {params && <p className="mt-1 text-xs text-ink-soft tabular" data-testid="swatch-params">{params}</p>}
          <p className="mt-1 text-xs text-ink-soft" data-testid="swatch-light">Light: <strong className="font-medium text-ink">{light > 0 ? '+' : light < 0 ? '−' : ''}{Math.abs(light)} st</strong>, {lightWords(light)}</p>
          {sel.notes && <p className="mt-1 text-sm text-ink-soft">{sel.notes}</p>}
        </div>
        <span className="h-12 w-12 shrink-0 rounded border border-paper-line" style={{ background: sel.hex }} aria-hidden="true" />
      </div>
      {(mayChange || mayDuplicate) && (
        <div className="mb-3 flex gap-2">
          {mayChange && onEdit && <Button onClick={onEdit}>Edit</Button>}
          {mayDuplicate && onDuplicate && <Button onClick={onDuplicate} disabled={duplicating}>{duplicating ? 'Duplicating…' : 'Duplicate'}</Button>}
        </div>
      )}
      {sel.reflectance && <SpectrumLine pairs={sel.reflectance} max={1} width={320} label={`${sel.spectrum} reflectance of ${sel.name}`} />}
      <p className="mt-1 text-xs text-ink-mute">{SPECTRUM_WORDS[sel.spectrum] ?? SPECTRUM_WORDS.estimated}</p>
      <h3 className="mb-2 mt-4 text-sm font-semibold">Through each look</h3>
      {tones.isPending && <Spinner label="Computing…" />}
      <div className="grid grid-cols-2 gap-2">
        {tones.data?.looks.map((l) => {
          const t = l.tones[0];
          return (
            <div key={l.lookId} data-testid="swatch-look-tone">
              <p className="mb-1 truncate text-xs font-medium" title={l.lookName}>{l.lookName}</p>
              <SplitChip name={`zone ${t.numeral}`} hex={sel.hex} tone={t} size="sm" />
            </div>
          );
        })}
      </div>
      {tones.data && <ToneSureness looks={tones.data.looks} measured={sel.spectrum === 'measured'} />}
      {light !== 0 && <p className="mt-1 text-[11px] text-ink-mute">The tones above include this surface’s own light ({lightWords(light)}).</p>}
      {children}
    </Card>
  );
}
