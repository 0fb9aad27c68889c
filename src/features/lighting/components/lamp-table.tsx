import type { LightPlanLampAnswer } from '../../../../shared/schemas/light-plan';
import { formatFootcandles, formatLux } from '../../../../shared/tone/exposure-format';
import { Button } from '../../../components/ui/button';
import type { LampDraft } from '../lib/plan-draft';
import { formatPlanStops } from '../lib/format-plan';

export interface LampTableProps {
  lamps: LampDraft[];
  /** the answer's rows, in the same order, or null while there is none for these rows */
  results: LightPlanLampAnswer[] | null;
  keyId: number | null;
  fillId: number | null;
  errors: Record<string, string>;
  onChange: (id: number, patch: Partial<LampDraft>) => void;
  onRole: (id: number, role: 'key' | 'fill') => void;
  onRemove: (id: number) => void;
  onAdd: () => void;
  maxLamps: number;
}

const cell = 'w-full rounded-md border border-paper-line bg-paper-raised px-1.5 py-1 text-sm tabular-nums aria-[invalid=true]:border-warn';
const th = 'px-1 pb-1 font-medium';

/** Lamps placed by distance, one row each: output, distance, angle and size in; lux, fc and stops against the need out. */
export function LampTable({ lamps, results, keyId, fillId, errors, onChange, onRole, onRemove, onAdd, maxLamps }: LampTableProps) {
  return (
    <div>
      <table className="w-full table-fixed text-sm" data-testid="lamp-table">
        <colgroup>
          <col className="w-9" /><col className="w-9" /><col className="w-[8rem]" /><col className="w-[6.5rem]" /><col className="w-[10rem]" />
          <col className="w-[4.5rem]" /><col className="w-[4.5rem]" /><col className="w-[4.5rem]" /><col /><col /><col className="w-[5.5rem]" /><col className="w-8" />
        </colgroup>
        <thead className="text-left text-[11px] uppercase tracking-wide text-ink-mute">
          <tr>
            <th className={th} title="the key light of the key-to-fill ratio">Key</th>
            <th className={th} title="the fill light of the key-to-fill ratio">Fill</th>
            <th className={th}>Lamp</th>
            <th className={th}>Output</th>
            <th className={th}>cd, or lm + beam°</th>
            <th className={th} title="lamp to subject, metres">Dist. m</th>
            <th className={th} title="angle of incidence at the subject, off the meter's axis (cosine law)">Angle °</th>
            <th className={th} title="the source's largest dimension, metres (for the five-times check)">Size m</th>
            <th className={`${th} text-right`}>lux</th>
            <th className={`${th} text-right`}>fc</th>
            <th className={`${th} text-right`} title="this lamp alone against the level needed">vs need</th>
            <th className={th}><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {lamps.map((l, i) => {
            const r = results?.[i];
            const err = (k: string) => errors[`lamps.${i}.${k}`];
            const rowErrors = Object.entries(errors).filter(([p]) => p.startsWith(`lamps.${i}.`)).map(([, m]) => m);
            const label = l.name.trim() || `lamp ${i + 1}`;
            const num = (k: 'intensityCd' | 'lumens' | 'beamAngleDeg' | 'distanceM' | 'angleDeg' | 'sizeM', aria: string, placeholder = '') => (
              <input
                type="number"
                inputMode="decimal"
                aria-label={`${aria} of ${label}`}
                placeholder={placeholder}
                value={l[k]}
                aria-invalid={!!err(k)}
                onChange={(e) => onChange(l.id, { [k]: e.target.value })}
                className={cell}
              />
            );
            return [
              <tr key={l.id} className="align-middle" data-testid={`lamp-row-${i}`}>
                <td className="px-1 text-center">
                  <input type="radio" name="key-lamp" aria-label={`${label} is the key`} checked={keyId === l.id} onChange={() => onRole(l.id, 'key')} />
                </td>
                <td className="px-1 text-center">
                  <input type="radio" name="fill-lamp" aria-label={`${label} is the fill`} checked={fillId === l.id} onChange={() => onRole(l.id, 'fill')} />
                </td>
                <td className="px-1 py-0.5">
                  <input aria-label={`Name of lamp ${i + 1}`} value={l.name} aria-invalid={!!err('name')} onChange={(e) => onChange(l.id, { name: e.target.value })} className={cell} />
                </td>
                <td className="px-1">
                  <select aria-label={`Output of ${label}`} value={l.output} onChange={(e) => onChange(l.id, { output: e.target.value as LampDraft['output'] })} className={cell}>
                    <option value="cd">candela</option>
                    <option value="lm">lumens</option>
                  </select>
                </td>
                <td className="px-1">
                  {l.output === 'cd' ? (
                    num('intensityCd', 'Candela', 'cd')
                  ) : (
                    <div className="flex gap-1">{num('lumens', 'Lumens', 'lm')}<span className="w-16 shrink-0">{num('beamAngleDeg', 'Beam angle', '°')}</span></div>
                  )}
                </td>
                <td className="px-1">{num('distanceM', 'Distance')}</td>
                <td className="px-1">{num('angleDeg', 'Angle')}</td>
                <td className="px-1">{num('sizeM', 'Size', '—')}</td>
                <td className="px-1 text-right tabular-nums" data-testid={`lamp-lux-${i}`}>{r ? formatLux(r.lux).replace(' lux', '') : '–'}</td>
                <td className="px-1 text-right tabular-nums" data-testid={`lamp-fc-${i}`}>{r ? formatFootcandles(r.fc).replace(' fc', '') : '–'}</td>
                <td className={`px-1 text-right tabular-nums ${r && r.stopsVsNeeded < 0 ? 'text-ink-soft' : ''}`}>{r ? formatPlanStops(r.stopsVsNeeded) : '–'}</td>
                <td className="px-1 text-right">
                  <button type="button" aria-label={`Remove ${label}`} disabled={lamps.length <= 1} onClick={() => onRemove(l.id)} className="rounded px-1.5 text-ink-mute hover:bg-paper-sunk hover:text-warn disabled:opacity-30">×</button>
                </td>
              </tr>,
              (rowErrors.length > 0 || r?.pointSource.ok === false || r?.intensityFrom === 'cone') && (
                <tr key={`${l.id}-note`}>
                  <td colSpan={2} />
                  <td colSpan={10} className="px-1 pb-1 text-[11px] leading-snug">
                    {rowErrors.map((m) => <span key={m} role="alert" className="mr-2 text-warn">{m}</span>)}
                    {r?.intensityFrom === 'cone' && !rowErrors.length && <span className="mr-2 text-ink-mute">≈ {Math.round(r.intensityCd).toLocaleString('en-GB')} cd by the uniform-cone model.</span>}
                    {r?.pointSource.ok === false && !rowErrors.length && <span className="text-warn" data-testid={`lamp-near-${i}`}>{r.pointSource.note}</span>}
                  </td>
                </tr>
              ),
            ];
          })}
        </tbody>
      </table>
      <div className="mt-2 flex items-center gap-3">
        <Button onClick={onAdd} disabled={lamps.length >= maxLamps}>Add a lamp</Button>
        {errors.lamps && <span role="alert" className="text-xs text-warn">{errors.lamps}</span>}
        <span className="text-[11px] text-ink-mute">Angle: between the lamp and the meter’s axis at the subject (cosine law). Size: the lamp’s face, for the five-times check; blank means assumed small.</span>
      </div>
    </div>
  );
}
