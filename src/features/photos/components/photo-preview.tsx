import { useState } from 'react';
import { ErrorMessage, Spinner } from '../../../components/ui/alert';
import { Segmented } from '../../../components/ui/segmented';
import type { LookDefinitionInput, LookView } from '../../../../shared/schemas/look';
import type { PhotoView } from '../../../../shared/schemas/photo';
import type { LoadedPhoto } from '../hooks/use-loaded-photo';
import type { TimedLut } from '../hooks/use-preview-lut';
import type { PreviewMode } from '../lib/gl-preview';
import type { Rect } from '../lib/region';
import { CompareLooks, useCompareSelection } from './compare-looks';
import { LookCanvas, type PreviewTiming, type Renderer } from './look-canvas';
import { RegionOverlay } from './region-overlay';
import { WipeOverlay, WipeSlider } from './wipe';
import { ZoneLegend } from './zone-legend';
import { UncertaintyLayer } from './uncertainty-layer';
import { UncertaintyLegend } from './uncertainty-legend';
import { useUncertaintyTable } from '../hooks/use-uncertainty-table';
import { uprightSize } from '../lib/photo-size';

export type PhotoViewMode = 'look' | 'wipe' | 'compare';

/** The photo through the look: alone (with the region reading), wiped against the colour original, or compared across looks. */
export function PhotoPreview({ pid, photo, look, looks, loaded, timed, error, loading, renderer, view, onView, rect, onRect, definition = null }: {
  pid: number;
  photo: PhotoView;
  look: LookView | undefined;
  looks: LookView[];
  loaded: LoadedPhoto | null;
  timed: TimedLut | null;
  error: unknown;
  loading: boolean;
  renderer: Renderer;
  view: PhotoViewMode;
  onView: (v: PhotoViewMode) => void;
  rect: Rect | null;
  onRect: (r: Rect) => void;
  /** the look with the live changes, when there are any (the uncertainty overlay follows them) */
  definition?: LookDefinitionInput | null;
}) {
  const [mode, setMode] = useState<PreviewMode>('look');
  const [wipe, setWipe] = useState(0.5);
  const [compare, setCompare] = useCompareSelection(looks);
  // a change's first frame, and its resting full frame when the first was a moving slider's
  const [timing, setTiming] = useState<{ first: PreviewTiming; full?: PreviewTiming } | null>(null);
  const onTiming = (t: PreviewTiming) => setTiming((s) => (t.quality === 'full' && s?.first.quality === 'drag' && !s.full ? { first: s.first, full: t } : { first: t }));
  const [unsure, setUnsure] = useState(false);
  const [shaded, setShaded] = useState<number | null>(null);
  const overlay = unsure && view !== 'compare';
  const uncertainty = useUncertaintyTable(pid, look?.id, definition, overlay);
  return (
    <>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <Segmented label="View" value={view} onChange={onView} options={[['look', 'Look'], ['wipe', 'Wipe'], ['compare', 'Compare']]} />
        <div className="flex flex-wrap items-center gap-2">
          <Segmented label="Show" value={mode} onChange={setMode} options={[['look', 'Grey'], ['zones', 'Zones']]} />
          <button
            type="button"
            aria-pressed={unsure}
            disabled={view === 'compare'}
            title={view === 'compare' ? 'Shown in the Look and Wipe views' : 'Shade where a colour’s grey is least sure through this look'}
            onClick={() => { setUnsure((x) => !x); setShaded(null); }}
            className={`rounded-md border px-3 py-1 text-sm disabled:opacity-50 ${unsure ? 'border-warn bg-warn text-white' : 'border-paper-line bg-paper-raised text-ink-soft hover:bg-paper-sunk'}`}
          >
            Uncertainty
          </button>
        </div>
      </div>
      <ErrorMessage error={error} />
      {loading && <Spinner label="Loading the preview…" />}
      {loaded && view !== 'compare' && (
        <LookCanvas
          loaded={loaded}
          timed={timed}
          options={{ mode, wipe: view === 'wipe' ? wipe : null }}
          renderer={renderer}
          label={`${photo.name} through ${look?.name ?? 'a look'}${view === 'wipe' ? ', wiped against the colour original' : ''}`}
          onTiming={onTiming}
        >
          {overlay && uncertainty.table && <UncertaintyLayer image={loaded.live.image} table={uncertainty.table} wipe={view === 'wipe' ? wipe : null} onShaded={(r) => setShaded(r.shaded)} />}
          {view === 'look' && <RegionOverlay width={loaded.image.width} height={loaded.image.height} rect={rect} onRect={onRect} />}
          {view === 'wipe' && <WipeOverlay wipe={wipe} onWipe={setWipe} lookName={look?.name} />}
        </LookCanvas>
      )}
      {loaded && view === 'wipe' && <WipeSlider wipe={wipe} onWipe={setWipe} />}
      {loaded && view === 'compare' && <CompareLooks pid={pid} looks={looks} compare={compare} onCompare={setCompare} loaded={loaded} mode={mode} renderer={renderer} />}
      {mode === 'zones' && <div className="mt-3 max-w-xl"><ZoneLegend /></div>}
      {overlay && <div className="mt-3 max-w-xl"><UncertaintyLegend status={uncertainty.status} pending={uncertainty.pending} lookName={look?.name ?? 'this look'} shaded={uncertainty.table ? shaded : null} error={uncertainty.error} /></div>}
      {timing && view !== 'compare' && (
        <p className="mt-2 text-xs text-ink-mute tabular" data-testid="preview-timing">
          Preview {timing.first.width} × {timing.first.height} px of a {uprightSize(photo).width} × {uprightSize(photo).height} px photo, {renderer === 'gl' ? 'WebGL2' : 'worker (no WebGL2)'}: {Math.round(timing.first.total)} ms from the change (table {Math.round(timing.first.table)} ms){timing.full ? `, the full frame ${Math.round(timing.full.total)} ms once the slider rested` : ''}.
        </p>
      )}
    </>
  );
}
