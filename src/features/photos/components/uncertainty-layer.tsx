import { useEffect, useRef, useState } from 'react';
import type { UncertaintyTable } from '../hooks/use-uncertainty-table';
import { uncertaintyEngine } from '../lib/uncertainty-engine';

/**
 * The uncertainty overlay: a canvas over the preview (whichever renderer draws it) shading each pixel in the
 * warning colour by how wide its plausible tone range is. Shaded in the worker from the frame's own pixels;
 * in a wipe only the grey side is covered.
 */
export function UncertaintyLayer({ image, table, wipe, onShaded }: {
  /** the preview frame's pixels, at the canvas's size */
  image: ImageData;
  table: UncertaintyTable;
  wipe: number | null;
  onShaded?: (s: { shaded: number; maxStops: number }) => void;
}) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const [state, setState] = useState<{ drawn: string; shaded: number } | null>(null);
  useEffect(() => {
    let live = true;
    uncertaintyEngine()
      .shade(table.key, table.size, table.widths, image)
      .then((r) => {
        const ctx = canvas.current?.getContext('2d');
        if (!live || !ctx) return;
        ctx.putImageData(new ImageData(r.rgba as Uint8ClampedArray<ArrayBuffer>, image.width, image.height), 0, 0);
        setState({ drawn: table.key, shaded: r.shaded });
        onShaded?.({ shaded: r.shaded, maxStops: r.maxStops });
      })
      .catch(() => live && setState(null));
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [image, table]);
  return (
    <canvas
      ref={canvas}
      width={image.width}
      height={image.height}
      aria-hidden="true"
      className="pointer-events-none absolute inset-0 h-full w-full"
      style={wipe === null ? undefined : { clipPath: `inset(0 0 0 ${(wipe * 100).toFixed(2)}%)` }}
      data-testid="uncertainty-layer"
      data-drawn={state?.drawn === table.key ? 'true' : 'false'}
      data-shaded={state ? state.shaded.toFixed(4) : ''}
    />
  );
}
