import { useMemo } from 'react';
import { toneSettingsSchema, type ToneSettings } from '../../../../shared/schemas/exposure';
import type { LookDefinition, LookAnalysis } from '../../../../shared/schemas/look';
import type { LookTones } from '../../../../shared/schemas/board';
import { toneMediumIdOfRef } from '../../../../shared/tone/exposure-plan';
import { mediumToneDefaults } from '../../../../shared/tone/media-tone';
import { ExposurePanel, type LightFactor } from './exposure-panel';
import { ToneSettingsForm } from './tone-settings-form';
import { CharacteristicCurveChart, type CurveSwatch } from './characteristic-curve-chart';

export interface BenchExposureProps {
  look: LookDefinition;
  /** the look's analysis (filter factors for its light, daylight and tungsten) */
  analysis: LookAnalysis;
  /** a board's tones through the look, pinned on the curve */
  board?: { tones: LookTones; swatches: { id: number; name: string; hex: string }[] } | null;
  /** called with the changed look; without it the camera fields change locally and the form is read-only */
  onLookChange?: (look: LookDefinition) => void;
  stale?: boolean;
}

/**
 * The exposure part of the bench: the EI chain and light level for the look's light, daylight or tungsten
 * (computed in the browser as the factor or the camera changes), the key and thresholds, and the curve
 * with the board's swatches pinned on it.
 */
export function BenchExposure({ look, analysis, board, onLookChange, stale }: BenchExposureProps) {
  const tone: ToneSettings = useMemo(() => toneSettingsSchema.parse(look.tone ?? {}), [look.tone]);
  const mediumId = toneMediumIdOfRef(look.medium);
  const factors: LightFactor[] = useMemo(() => [
    { key: 'look', label: 'This light', ...analysis.factor },
    { key: 'daylight', label: 'Daylight', ...analysis.daylight },
    { key: 'tungsten', label: 'Tungsten', ...analysis.tungsten },
  ], [analysis.factor, analysis.daylight, analysis.tungsten]);
  const filterLabel = analysis.curves.filter((c) => c.role === 'filter').map((c) => c.label).join(' + ');
  const pins: CurveSwatch[] = useMemo(() => {
    if (!board) return [];
    const byId = new Map(board.swatches.map((s) => [s.id, s]));
    return board.tones.tones.map((t) => ({ name: byId.get(t.swatchId)?.name ?? `swatch ${t.swatchId}`, stops: t.stops, colour: byId.get(t.swatchId)?.hex ?? '#777777' }));
  }, [board]);
  const setTone = onLookChange ? (t: ToneSettings) => onLookChange({ ...look, tone: t }) : undefined;

  return (
    <section aria-label="Exposure" aria-busy={stale} className={`space-y-5 ${stale ? 'opacity-80 transition-opacity' : ''}`}>
      <h2 className="text-base">Exposure</h2>
      <ExposurePanel mediumId={mediumId} tone={tone} factors={factors} filterLabel={filterLabel} onToneChange={setTone} />
      <ToneSettingsForm mediumId={mediumId} value={tone} onChange={setTone ?? (() => undefined)} disabled={!setTone}
        keySwatches={board?.swatches ?? []} sections={['box', 'key']} />
      <div>
        <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
          {mediumToneDefaults(mediumId).kind === 'negative' ? 'Characteristic curve' : 'Display curve'}{pins.length ? ' and the board' : ''}
        </h3>
        <CharacteristicCurveChart mediumId={mediumId} settings={tone} boxSpeed={tone.boxSpeed ?? undefined} swatches={pins} height={260} />
      </div>
    </section>
  );
}
