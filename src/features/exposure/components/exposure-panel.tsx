import { useState } from 'react';
import type { ToneSettings } from '../../../../shared/schemas/exposure';
import type { CameraSettings } from '../../../../shared/tone/exposure-plan';
import { formatFactor, formatStopsLabel } from '../../../../shared/tone/exposure-format';
import { useExposurePlan } from '../hooks/use-exposure-plan';
import { EiChainPanel } from './ei-chain-panel';
import { LightLevelPanel } from './light-level-panel';

/** A filter factor for one light (the shape of the look analysis' FactorForLight, with a label). */
export interface LightFactor {
  /** stable key, e.g. 'look', 'daylight', 'tungsten' */
  key: string;
  /** what the button says, e.g. "This look's light" */
  label: string;
  /** the light, e.g. "Tungsten 3200 K" */
  light: string;
  /** filter factor in stops (log2 F) */
  stops: number;
  opaque?: boolean;
}

export interface ExposurePanelProps {
  /** the tone model's medium id (shared/tone/exposure-plan toneMediumIdOfRef) */
  mediumId: string;
  tone: ToneSettings;
  /** filter factors to choose from; the first is chosen at first */
  factors: LightFactor[];
  /** the filters, for the chain's words */
  filterLabel?: string;
  /** called when the camera fields change; without it they change here only */
  onToneChange?: (tone: ToneSettings) => void;
}

/**
 * The EI chain and the light level of a look side by side, for a light chosen among the look's own,
 * daylight and tungsten. Everything is computed in the browser (shared/tone), so both follow a filter
 * or light change at once.
 */
export function ExposurePanel({ mediumId, tone, factors, filterLabel, onToneChange }: ExposurePanelProps) {
  const [chosen, setChosen] = useState<string | null>(null);
  const [localCamera, setLocalCamera] = useState<Required<CameraSettings> | null>(null);
  const factor = factors.find((f) => f.key === chosen) ?? factors[0];
  const camera: Required<CameraSettings> = onToneChange || !localCamera
    ? { tStop: tone.tStop, fps: tone.fps, shutterAngle: tone.shutterAngle, calibrationConstant: tone.calibrationConstant }
    : localCamera;
  const effective = { ...tone, ...camera };
  const { plan, boxSpeed } = useExposurePlan(mediumId, effective, factor?.stops ?? 0);

  if (boxSpeed === null) {
    return <p className="text-sm text-ink-mute">The eye is the reference medium: it has no exposure index, so there is no EI chain or light level to show.</p>;
  }
  if (!plan || !factor) return <p className="text-sm text-ink-mute">The exposure cannot be worked out for these settings.</p>;

  return (
    <div className="space-y-4" data-testid="exposure-panel">
      {factors.length > 1 && (
        <fieldset className="flex flex-wrap items-center gap-1 text-sm">
          <legend className="sr-only">Filter factor for</legend>
          <span className="mr-1 text-xs text-ink-soft">Filter factor for</span>
          {factors.map((f) => {
            const active = f.key === factor.key;
            return (
              <button
                key={f.key}
                type="button"
                aria-pressed={active}
                onClick={() => setChosen(f.key)}
                title={`${f.light}: ${formatStopsLabel(f.stops)} (${formatFactor(2 ** f.stops)})`}
                className={`rounded-md border px-2 py-0.5 text-xs ${active ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised text-ink-soft hover:bg-paper-sunk'}`}
              >
                {f.label}
              </button>
            );
          })}
        </fieldset>
      )}
      <div className="grid gap-5 xl:grid-cols-2">
        <EiChainPanel plan={plan} developmentStops={tone.developmentStops} lightLabel={factor.light} filterLabel={filterLabel} opaque={factor.opaque} />
        <LightLevelPanel
          plan={plan}
          camera={camera}
          onCameraChange={(c) => (onToneChange ? onToneChange({ ...tone, ...c }) : setLocalCamera(c))}
        />
      </div>
    </div>
  );
}
