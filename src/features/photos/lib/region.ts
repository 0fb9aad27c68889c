/**
 * Reading a region of the preview: its mean colour, averaged in linear light (IEC 61966-2-1), and
 * where that colour lands through a look (the preview's table, shared/photo).
 */
import { srgbDecode, srgbEncode } from '../../../../shared/tone/print';
import { sampleExposureLut } from '../../../../shared/photo/exposure-lut';
import { greyOfStops, zoneOfStops } from '../../../../shared/look/tone-curve-table';
import type { PreviewLut } from './preview-protocol';

/** A region's mean colour and where it lands through the look. */
export interface RegionReading {
  /** mean colour, sRGB-encoded 0..1 */
  colour: [number, number, number];
  stops: number;
  zone: number;
  /** output grey 0..1 */
  grey: number;
  /** in the original's pixels */
  rect: [number, number, number, number];
}

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

const DECODE = Float64Array.from({ length: 256 }, (_, i) => srgbDecode(i / 255));

/** Mean sRGB colour (encoded, 0..1 each) of a rectangle of RGBA pixels, averaged in linear light. */
export function meanColour(img: ImageData, r: Rect): [number, number, number] {
  let sr = 0;
  let sg = 0;
  let sb = 0;
  let n = 0;
  const x1 = Math.min(img.width, r.x + r.width);
  const y1 = Math.min(img.height, r.y + r.height);
  for (let y = Math.max(0, r.y); y < y1; y++) {
    for (let x = Math.max(0, r.x); x < x1; x++) {
      const i = (y * img.width + x) * 4;
      sr += DECODE[img.data[i]];
      sg += DECODE[img.data[i + 1]];
      sb += DECODE[img.data[i + 2]];
      n++;
    }
  }
  if (!n) return [0, 0, 0];
  return [srgbEncode(sr / n), srgbEncode(sg / n), srgbEncode(sb / n)];
}

export const toHex = (c: readonly number[]) => '#' + c.map((v) => Math.round(Math.min(1, Math.max(0, v)) * 255).toString(16).padStart(2, '0')).join('');

/** Where a colour lands through a look's preview table: stops, zone and the output grey (0..1). */
export function toneOfColour(lut: PreviewLut, c: readonly number[]): { stops: number; zone: number; grey: number } {
  const stops = sampleExposureLut(lut, c[0], c[1], c[2]);
  return { stops: stops + lut.tone.offsetStops, zone: zoneOfStops(lut.tone, stops), grey: greyOfStops(lut.tone, stops) };
}

/**
 * The reading of a rectangle of the preview `img` (its own pixels): mean colour, tone through `lut`, and the
 * rectangle scaled to the original's pixels (`original` width × height; at least 1 px each way).
 */
export function readRegion(img: ImageData, r: Rect, lut: PreviewLut, original: { width: number; height: number }): RegionReading {
  const colour = meanColour(img, r);
  const sx = original.width / img.width;
  const sy = original.height / img.height;
  const [x, width] = scaleSpan(r.x, r.width, sx, original.width);
  const [y, height] = scaleSpan(r.y, r.height, sy, original.height);
  return { colour, ...toneOfColour(lut, colour), rect: [x, y, width, height] };
}

/**
 * One side of a rectangle scaled to the original: start and length rounded, at least 1 px, and kept inside
 * 0..size (rounding start and length separately could reach 1 px past the edge, which the server refuses).
 */
export function scaleSpan(start: number, length: number, scale: number, size: number): [number, number] {
  const s = Math.min(Math.max(0, Math.round(start * scale)), size - 1);
  const l = Math.min(Math.max(1, Math.round(length * scale)), size - s);
  return [s, l];
}
