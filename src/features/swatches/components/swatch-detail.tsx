import type { ReactNode } from 'react';
import { Spinner } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { SplitChip } from '../../../components/ui/split-chip';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { useSwatchTones } from '../api/get-swatch-tones';
import { SpectrumBadge } from './spectrum-badge';
import { SpectrumLine } from './spectrum-line';
import { ToneSureness } from './tone-sureness';

/** One swatch: its colour, reflectance, and its tone through each look; `children` below (e.g. putting it on a board). */
export function SwatchDetail({ pid, swatch: sel, children }: { pid: number; swatch: SwatchView; children?: ReactNode }) {
  const tones = useSwatchTones(pid, sel.id);
  return (
    <Card aria-label={`Swatch ${sel.name}`}>
      <div className="mb-2 flex items-start justify-between gap-2">
        <div>
          <h2>{sel.name}</h2>
          <p className="text-xs text-ink-mute">{sel.department} · {sel.hex} · <SpectrumBadge s={sel} /></p>
          {sel.notes && <p className="mt-1 text-sm text-ink-soft">{sel.notes}</p>}
        </div>
        <span className="h-12 w-12 shrink-0 rounded border border-paper-line" style={{ background: sel.hex }} aria-hidden="true" />
      </div>
      {sel.reflectance && <SpectrumLine pairs={sel.reflectance} max={1} width={320} label={`${sel.spectrum} reflectance of ${sel.name}`} />}
      <p className="mt-1 text-xs text-ink-mute">{sel.spectrum === 'measured' ? 'Measured reflectance (350–900 nm; beyond the measurement its end values are held).' : 'Estimated reflectance: a smooth spectrum that gives this colour in daylight (D65). A measurement would be better.'}</p>
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
      {children}
    </Card>
  );
}
