import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { LookView } from '../../../../shared/schemas/look';
import type { PhotoView } from '../../../../shared/schemas/photo';
import { usePhotoLook } from '../api/get-photo-look';
import { editedDefinition, hasEdits, type LookEdits } from '../lib/look-edits';
import { readRegion, type Rect } from '../lib/region';
import { useLoadedPhoto } from './use-loaded-photo';
import { uprightSize } from '../lib/photo-size';
import { usePreviewLut } from './use-preview-lut';
import { chooseRenderer } from '../lib/renderer';

/**
 * One photo through one look while it is retuned: the live edits, the sampled region and its reading, the
 * decoded photo and the look's table. Edits, region and the kept notice start afresh when the photo or the
 * look changes.
 */
export function usePhotoSession(pid: number, photo: PhotoView | undefined, look: LookView | undefined) {
  const [edits, setEdits] = useState<{ e: LookEdits; at?: number }>({ e: {} });
  const [rect, setRect] = useState<Rect | null>(null);
  const [kept, setKept] = useState<string | null>(null);
  useEffect(() => {
    setEdits({ e: {} });
    setRect(null);
    setKept(null);
  }, [look?.id, photo?.id]);

  const photoLook = usePhotoLook(pid, look?.id ?? 0);
  const { loaded, error: loadError } = useLoadedPhoto(photo);
  // a moving slider's small tables for the GPU only (the page's renderer, as the page chooses it)
  const [search] = useSearchParams();
  const { timed, error: lutError } = usePreviewLut(photoLook.data?.look, edits.e, edits.at, chooseRenderer(search.get('renderer')) === 'gl');
  const reading = useMemo(
    () => (rect && loaded && timed && photo ? readRegion(loaded.image, rect, timed.lut, uprightSize(photo)) : null),
    [rect, loaded, timed, photo],
  );
  const definition = look && photoLook.data && hasEdits(edits.e) ? editedDefinition(look, photoLook.data.look, edits.e) : null;
  return {
    photoLook,
    loaded,
    timed,
    error: loadError ?? lutError ?? photoLook.error,
    loadError,
    edits: edits.e,
    setEdits: (e: LookEdits, at?: number) => setEdits({ e, at }),
    rect,
    setRect,
    reading,
    definition,
    kept,
    setKept,
  };
}
