import { useEffect, useLayoutEffect, useRef, useState, type ReactNode } from 'react';
import { GlPreview, type DrawOptions } from '../lib/gl-preview';
import { paintCpu, type CpuFrame } from '../lib/cpu-preview';
import { previewEngine } from '../lib/preview-engine';
import type { LoadedPhoto } from '../hooks/use-loaded-photo';
import type { TimedLut } from '../hooks/use-preview-lut';
import type { PreviewQuality } from '../lib/preview-protocol';

export type Renderer = 'gl' | 'cpu';

/**
 * Resolution of the frames drawn from a moving slider's small table, of the full frame's (a quarter of
 * the pixels). They are drawn on a canvas of their own laid over the full one (resizing one canvas back
 * and forth costs a software GPU more than the smaller draw saves) and hidden when the full frame is drawn.
 */
export const DRAG_SCALE = 0.4;

/** One latency record: from the change to the frame on screen. */
export interface PreviewTiming {
  /** ms from the input to the drawn frame */
  total: number;
  /** ms the worker spent building the table */
  table: number;
  /** ms of the draw itself */
  draw: number;
  renderer: Renderer;
  /** 'drag': a moving slider's frame (small table, reduced resolution); 'full': the resting frame */
  quality: PreviewQuality;
  /** the frame's full size, px */
  width: number;
  height: number;
}

declare global {
  interface Window {
    /** every preview frame's timing, for the browser test and the curious (newest last) */
    __grisaillePreview?: PreviewTiming[];
  }
}

/** Tables already timed (a remount or a change of view is not a retune and is not timed again). */
const timedAlready = new WeakSet<TimedLut>();

function record(t: PreviewTiming) {
  (window.__grisaillePreview ??= []).push(t);
  if (window.__grisaillePreview.length > 200) window.__grisaillePreview.shift();
}

/**
 * A photo through a look, live: WebGL2 when the browser has it, otherwise the worker (CPU). The live
 * canvas is 1600 px wide (narrower previews keep their width) and scaled to fit by CSS; comparisons
 * use a smaller frame. Children are laid over it (the region being read, the wipe line).
 */
export function LookCanvas({ loaded, size = 'live', timed, options, renderer, label, onTiming, children }: {
  loaded: LoadedPhoto;
  /** the live frame (at least 1600 px wide) or the small one for comparisons */
  size?: 'live' | 'small';
  timed: TimedLut | null;
  options: DrawOptions;
  renderer: Renderer;
  label: string;
  onTiming?: (t: PreviewTiming) => void;
  children?: ReactNode;
}) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const gl = useRef<GlPreview | null>(null);
  const photoKey = useRef('');
  const dragCanvas = useRef<HTMLCanvasElement>(null);
  const dragGl = useRef<GlPreview | null>(null);
  const dragPhotoKey = useRef('');
  const cpuFrame = useRef<{ key: string; frame: CpuFrame } | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const frame = size === 'live' ? loaded.live : loaded.small;
  const { width, height } = frame;
  const frameKey = `${loaded.key}|${size}`;

  useLayoutEffect(() => () => {
    gl.current?.dispose();
    gl.current = null;
    dragGl.current?.dispose();
    dragGl.current = null;
  }, []);

  // the drag canvas's context and photo made ahead, after the frame is on screen, so a slider's first move does not pay for them
  useEffect(() => {
    const small = dragCanvas.current;
    if (renderer !== 'gl' || !small) return;
    const id = setTimeout(() => {
      try {
        dragGl.current ??= new GlPreview(small);
        if (dragPhotoKey.current !== frameKey) {
          dragGl.current.setPhoto(frame.bitmap, frame.bitmap.width);
          dragPhotoKey.current = frameKey;
        }
      } catch {
        /* drawn (or its failure shown) when a slider moves */
      }
    }, 100);
    return () => clearTimeout(id);
  }, [frame, frameKey, renderer]);

  useLayoutEffect(() => {
    const c = canvas.current;
    if (!c) return;
    const started = performance.now();
    const report = (tableMs: number) => {
      if (!timed || timedAlready.has(timed)) return;
      timedAlready.add(timed);
      const t: PreviewTiming = { total: performance.now() - timed.requestedAt, table: tableMs, draw: performance.now() - started, renderer, quality: timed.lut.quality, width, height };
      record(t);
      onTiming?.(t);
    };
    if (renderer === 'gl') {
      try {
        const small = dragCanvas.current;
        if (timed?.lut.quality === 'drag' && small) {
          if (!dragGl.current) dragGl.current = new GlPreview(small);
          if (dragPhotoKey.current !== frameKey) {
            dragGl.current.setPhoto(frame.bitmap, frame.bitmap.width); // point samples: one texel a pixel, the cheapest read
            dragPhotoKey.current = frameKey;
          }
          dragGl.current.setLut(timed.lut);
          if (dragGl.current.draw(options)) report(timed.lut.ms);
          small.hidden = false;
          setFailed(null);
          return;
        }
        if (!gl.current) gl.current = new GlPreview(c);
        if (photoKey.current !== frameKey) {
          gl.current.setPhoto(frame.bitmap);
          photoKey.current = frameKey;
        }
        if (timed) gl.current.setLut(timed.lut);
        if (gl.current.draw(options) && timed) report(timed.lut.ms);
        if (small) small.hidden = true;
        setFailed(null);
      } catch (e) {
        setFailed((e as Error).message);
      }
      return;
    }
    // CPU: the worker renders the pixels, this paints them
    const ctx = c.getContext('2d');
    if (!ctx) return;
    const key = timed?.lut.key ?? '';
    const wantZones = options.mode === 'zones';
    const have = cpuFrame.current;
    if (!timed || options.mode === 'original' || (have?.key === `${key}|${frameKey}` && (!wantZones || have.frame.zone))) {
      paintCpu(ctx, frame.image, cpuFrame.current?.frame ?? null, options);
      if (timed && options.mode !== 'original') report(timed.lut.ms);
      return;
    }
    let live = true;
    previewEngine()
      .apply(key, frameKey, frame.image, wantZones)
      .then((r) => {
        if (!live) return;
        cpuFrame.current = { key: `${key}|${frameKey}`, frame: r };
        paintCpu(ctx, frame.image, r, options);
        report(timed.lut.ms + r.ms);
      })
      .catch((e: Error) => live && setFailed(e.message));
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [frame, timed, options.mode, options.wipe, renderer]);

  return (
    <figure className="relative m-0">
      <div className="relative overflow-hidden rounded-md border border-paper-line bg-ink">
        <canvas
          ref={canvas}
          width={width}
          height={height}
          className="block h-auto w-full"
          role="img"
          aria-label={label}
          data-renderer={renderer}
          data-lut-key={timed?.lut.key ?? ''}
          data-quality={timed?.lut.quality ?? ''}
        />
        {renderer === 'gl' && size === 'live' && (
          <canvas ref={dragCanvas} width={Math.round(width * DRAG_SCALE)} height={Math.round(height * DRAG_SCALE)} className="pointer-events-none absolute inset-0 h-full w-full" aria-hidden="true" data-testid="preview-drag-frame" hidden />
        )}
        {children}
      </div>
      {failed && <p role="alert" className="mt-1 text-xs text-warn">The preview could not be drawn: {failed}</p>}
    </figure>
  );
}
