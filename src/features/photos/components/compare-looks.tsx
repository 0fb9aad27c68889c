import { useEffect, useState } from 'react';
import { ErrorMessage } from '../../../components/ui/alert';
import { MAX_COMPARE_LOOKS, type LookView } from '../../../../shared/schemas/look';
import { usePhotoLook } from '../api/get-photo-look';
import { usePreviewLut } from '../hooks/use-preview-lut';
import type { LoadedPhoto } from '../hooks/use-loaded-photo';
import type { PreviewMode } from '../lib/gl-preview';
import { LookCanvas, type Renderer } from './look-canvas';

/** One look of the comparison: its own table, the same photo. */
function CompareCell({ pid, look, loaded, mode, renderer }: { pid: number; look: LookView; loaded: LoadedPhoto; mode: PreviewMode; renderer: Renderer }) {
  const view = usePhotoLook(pid, look.id);
  const { timed, error } = usePreviewLut(view.data?.look, {});
  return (
    <div>
      <p className="mb-1 truncate text-sm font-medium">{look.name}</p>
      <LookCanvas loaded={loaded} size="small" timed={timed} options={{ mode, wipe: null }} renderer={renderer} label={`${loaded.photo.name} through ${look.name}`} />
      <ErrorMessage error={view.error ?? error} />
    </div>
  );
}

/** The looks to compare: the first three until the user picks (up to MAX_COMPARE_LOOKS). */
export function useCompareSelection(looks: LookView[]) {
  const [compare, setCompare] = useState<number[]>([]);
  useEffect(() => {
    if (!compare.length && looks.length) setCompare(looks.slice(0, Math.min(MAX_COMPARE_LOOKS, 3)).map((l) => l.id));
  }, [looks, compare.length]);
  return [compare, setCompare] as const;
}

/** The same photo through several looks side by side, with the choice of looks; the cells keep the looks' list order, whatever order they were ticked in. */
export function CompareLooks({ pid, looks, compare, onCompare, loaded, mode, renderer }: {
  pid: number;
  looks: LookView[];
  compare: number[];
  onCompare: (ids: number[]) => void;
  loaded: LoadedPhoto;
  mode: PreviewMode;
  renderer: Renderer;
}) {
  return (
    <>
      <fieldset className="mb-3 flex flex-wrap gap-3 text-sm">
        <legend className="sr-only">Looks to compare (up to {MAX_COMPARE_LOOKS})</legend>
        {looks.map((l) => {
          const on = compare.includes(l.id);
          return (
            <label key={l.id} className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={on}
                disabled={!on && compare.length >= MAX_COMPARE_LOOKS}
                onChange={() => onCompare(on ? compare.filter((x) => x !== l.id) : [...compare, l.id])}
              />
              {l.name}
            </label>
          );
        })}
      </fieldset>
      <div className={`grid gap-3 ${compare.length > 1 ? 'sm:grid-cols-2' : ''}`}>
        {looks.filter((l) => compare.includes(l.id)).map((l) => (
          <CompareCell key={l.id} pid={pid} look={l} loaded={loaded} mode={mode} renderer={renderer} />
        ))}
      </div>
    </>
  );
}
