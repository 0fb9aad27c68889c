/**
 * The preview without WebGL2: the worker applies the look's table to the preview's pixels
 * (shared/photo/apply-lut.ts), and this composes the grey, the zone map (posterised, with the same
 * warning hatching beyond the scale) or the original into a 2-D canvas.
 */
import type { DrawOptions } from './gl-preview';

const ZONE_GREY = [0x00, 0x1b, 0x30, 0x47, 0x5e, 0x77, 0x91, 0xab, 0xc6, 0xe2, 0xff];
const WARN = 0xff0c41c2; // #c2410c as little-endian RGBA

export interface CpuFrame {
  grey: Uint8Array;
  /** 0 under zone 0, 1..11 zones 0..X, 12 over X (null until the zone map was asked for) */
  zone: Uint8Array | null;
}

const greyPx = (g: number) => (0xff000000 | (g << 16) | (g << 8) | g) >>> 0;

/** Paints a frame; `original` is the preview's RGBA at the canvas's size. */
export function paintCpu(ctx: CanvasRenderingContext2D, original: ImageData, frame: CpuFrame | null, o: DrawOptions): void {
  const { width, height } = original;
  const out = ctx.createImageData(width, height);
  const d = new Uint32Array(out.data.buffer);
  const src = new Uint32Array(original.data.buffer, original.data.byteOffset, width * height);
  const wipeX = o.wipe === null ? -1 : Math.round(o.wipe * width);
  const zones = o.mode === 'zones' && frame?.zone ? frame.zone : null;
  for (let y = 0, p = 0; y < height; y++) {
    for (let x = 0; x < width; x++, p++) {
      if (o.mode === 'original' || x < wipeX || !frame) d[p] = src[p] | 0xff000000;
      else if (zones) {
        const z = zones[p];
        if (z === 0 || z === 12) d[p] = (x + (z === 0 ? y : -y) + 14000) % 14 < 5 ? WARN : greyPx(ZONE_GREY[z === 0 ? 0 : 10]);
        else d[p] = greyPx(ZONE_GREY[z - 1]);
      } else d[p] = greyPx(frame.grey[p]);
    }
  }
  ctx.putImageData(out, 0, 0);
}
