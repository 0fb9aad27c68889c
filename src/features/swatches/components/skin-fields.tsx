import { useState } from 'react';
import { PresetButtons } from '../../../components/ui/preset-buttons';
import { CALM_SKIN, SKIN_CONTROLS, SKIN_PRESETS, bruiseAt } from '../../../../shared/spectral/skin-presets';
import type { SkinParams } from '../../../lib/swatch-source';

/** Physical names of the controls' quantities, as shown beside the slider. */
const QUANTITY: Record<string, string> = { melanin: 'melanin', blood: 'blood', oxygenation: 'O₂ saturation', pheomelanin: 'pheomelanin', bilirubin: 'bilirubin', carotene: 'carotene', bruiseAgeDays: 'age' };

/** A control's value in its physical unit: "blood 2.4 %", "bilirubin 120 µmol/L", "age 5 days". */
export function physicalValue(key: string, value: number, unit: string): string {
  const q = QUANTITY[key] ?? key;
  if (/fraction|saturation|share/.test(unit)) { const pc = value * 100; return `${q} ${pc.toFixed(pc < 10 ? 1 : 0)} %`; }
  if (unit === 'days') return `${q} ${value.toFixed(1)} days`;
  return `${q} ${value >= 10 || value === 0 ? value.toFixed(0) : value.toFixed(1)} ${unit}`;
}

/** The bruise presets' age, days, on the calm skin (skin-presets.ts). */
const BRUISE_DAYS: Record<string, number> = { 'skin-bruise-fresh': 0.5, 'skin-bruise-old': 5 };

/** The preset whose parameters these are, if any. */
export const presetOf = (skin: SkinParams) => SKIN_PRESETS.find((p) => JSON.stringify(p.skin) === JSON.stringify(skin));

const DEFAULT_OF: Record<string, number> = { pheomelanin: 0.2, bilirubin: 0, carotene: 0 };

/**
 * Skin from physics: a preset to start from (light to dark, flushed, pale, bruised) and a slider per
 * parameter in the department's words, the physical value beside it.
 */
export function SkinFields({ skin, onChange, errors }: { skin: SkinParams; onChange: (s: SkinParams) => void; errors: (k: string) => string | undefined }) {
  const current = presetOf(skin);
  // the bruise-age slider adds a bruise of that age to the skin it started from
  const [bruise, setBruise] = useState<{ days: number; base: SkinParams }>(() => ({ days: current ? BRUISE_DAYS[current.id] ?? 0 : 0, base: current && BRUISE_DAYS[current.id] ? CALM_SKIN : skin }));
  return (
    <div className="grid gap-3">
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Start from</legend>
        <PresetButtons label="Skin presets" presets={SKIN_PRESETS} chosen={current}
          onPick={(p) => { setBruise({ days: BRUISE_DAYS[p.id] ?? 0, base: BRUISE_DAYS[p.id] ? CALM_SKIN : p.skin }); onChange({ ...p.skin }); }} />
      </fieldset>
      <div className="grid gap-2">
        {SKIN_CONTROLS.map((c) => {
          const derived = c.key === 'bruiseAgeDays';
          const key = c.key as keyof SkinParams;
          const value = derived ? bruise.days : skin[key] ?? DEFAULT_OF[key] ?? 0;
          const err = derived ? undefined : errors(`origin.skin.${key}`);
          const move = (v: number) => {
            if (derived) {
              const base = bruise.days === 0 ? skin : bruise.base;
              setBruise({ days: v, base });
              onChange(v === 0 ? { ...base } : bruiseAt(v, base));
            } else {
              const next = { ...skin, [key]: v };
              setBruise({ days: bruise.days, base: bruise.days === 0 ? next : { ...bruise.base, [key]: v } });
              onChange(next);
            }
          };
          return (
            <div key={c.key} className="grid grid-cols-[7rem_minmax(0,1fr)_9.5rem] items-center gap-2" title={c.note}>
              <label htmlFor={`skin-${c.key}`} className="text-sm font-medium">{c.label}</label>
              <input id={`skin-${c.key}`} type="range" min={c.min} max={c.max} step={c.step} value={value} aria-invalid={!!err}
                aria-valuetext={`${c.label}: ${physicalValue(c.key, value, c.unit)}`}
                onChange={(e) => move(Number(e.target.value))} className="w-full accent-accent" />
              <output htmlFor={`skin-${c.key}`} className="text-right text-xs tabular text-ink-soft" data-testid={`skin-value-${c.key}`}>{physicalValue(c.key, value, c.unit)}</output>
              {err && <p role="alert" className="col-span-3 text-xs text-warn">{err}</p>}
            </div>
          );
        })}
      </div>
      <p className="text-xs text-ink-mute">Skin made from physics: melanin in a thin epidermis over a blood-filled dermis. Its spectrum is modelled, with the haemoglobin bands a colour value cannot carry.</p>
    </div>
  );
}
