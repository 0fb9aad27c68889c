import { api } from '../../../lib/api-client';
import { useEffect, useState } from 'react';
import type { PhotoView } from '../../../../shared/schemas/photo';

/** Widest live canvas, px: the preview is drawn at least this wide (or at its own width when narrower). */
export const LIVE_WIDTH = 1600;
/** Width of each canvas when four looks are compared, px. */
export const SMALL_WIDTH = 960;

/** The preview scaled for one canvas size: a bitmap for the GPU, pixels for the CPU fallback. */
export interface PhotoFrame {
  width: number;
  height: number;
  bitmap: ImageBitmap;
  image: ImageData;
}

/** A photo's preview, decoded once: full size for reading regions, and scaled frames for the canvases. */
export interface LoadedPhoto {
  key: string;
  photo: PhotoView;
  /** the stored preview's own pixels (a region reading reads these) */
  image: ImageData;
  live: PhotoFrame;
  small: PhotoFrame;
}

async function frame(full: ImageBitmap, width: number): Promise<PhotoFrame> {
  const w = Math.min(width, full.width);
  const h = Math.round((full.height * w) / full.width);
  const bitmap = w === full.width ? full : await createImageBitmap(full, { resizeWidth: w, resizeHeight: h, resizeQuality: 'high', colorSpaceConversion: 'none', premultiplyAlpha: 'none' });
  return { width: w, height: h, bitmap, image: pixels(bitmap) };
}

function pixels(bitmap: ImageBitmap): ImageData {
  const c = document.createElement('canvas');
  c.width = bitmap.width;
  c.height = bitmap.height;
  const ctx = c.getContext('2d', { willReadFrequently: true })!;
  ctx.drawImage(bitmap, 0, 0);
  return ctx.getImageData(0, 0, c.width, c.height);
}

const cache = new Map<string, Promise<LoadedPhoto>>();

async function load(photo: PhotoView): Promise<LoadedPhoto> {
  const blob = await api.get<Blob>(photo.urls.preview, { blob: true });
  const bitmap = await createImageBitmap(blob, { colorSpaceConversion: 'none', premultiplyAlpha: 'none' });
  const [live, small] = await Promise.all([frame(bitmap, LIVE_WIDTH), frame(bitmap, SMALL_WIDTH)]);
  return { key: `${photo.id}:${photo.urls.preview}`, photo, image: pixels(bitmap), live, small };
}

/** The decoded preview of `photo` (null while loading). */
export function useLoadedPhoto(photo: PhotoView | undefined): { loaded: LoadedPhoto | null; error: Error | null } {
  const [state, setState] = useState<{ loaded: LoadedPhoto | null; error: Error | null }>({ loaded: null, error: null });
  useEffect(() => {
    if (!photo) return;
    let live = true;
    const key = `${photo.id}:${photo.urls.preview}`;
    if (!cache.has(key)) cache.set(key, load(photo));
    setState((s) => (s.loaded?.key === key ? s : { loaded: null, error: null }));
    cache.get(key)!.then(
      (loaded) => live && setState({ loaded, error: null }),
      (error: Error) => {
        cache.delete(key);
        if (live) setState({ loaded: null, error });
      },
    );
    return () => {
      live = false;
    };
  }, [photo]);
  return state;
}
