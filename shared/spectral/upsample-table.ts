/**
 * The tabulated upsampling (Jakob & Hanika 2019, see upsample.ts): coefficients fitted once on a
 * 3 × R³ grid over linear sRGB, looked up by trilinear interpolation. Parameters and source:
 * data/upsample/method.json. The table is big (R = 32: 294,912 floats), so it is passed in by the
 * caller: built by `buildUpsampleTable()` (about a second or two) and cached by the server
 * (server/services/upsample-table.ts), fetched by the browser as binary (GET /api/library/upsample-table).
 *
 * Layout (as in the paper): for a linear colour, l = index of its largest channel, z = that channel,
 * x = rgb[(l+1)%3] / z, y = rgb[(l+2)%3] / z. Nodes: x and y uniform on 0..1; z at
 * smoothstep(smoothstep(k / (R − 1))). coefficients[((((l·R + zi)·R + yi)·R + xi)·3 + c].
 *
 * Binary form (little-endian): bytes 0–3 "GSU1"; uint32 R; uint32 method version; float32 zNodes[R];
 * float32 coefficients[3·R³·3].
 */
import methodJson from '../../data/upsample/method.json';
import { linearSrgbToXyz } from './colour';
import type { Rgb3 } from './types';
import { fitCoefficients, type Coefficients } from './upsample';

/** The coefficient table. */
export interface UpsampleTable {
  readonly resolution: number;
  readonly version: number;
  readonly zNodes: Float32Array;
  readonly coefficients: Float32Array;
}

/** Method parameters and published source of the table (data/upsample/method.json). */
export const UPSAMPLE_METHOD: { name: string; source: string; version: number; resolution: number } = methodJson;

const MAGIC = 'GSU1';

function smoothstep(x: number): number {
  return x * x * (3 - 2 * x);
}

/** z nodes of a table of resolution R: smoothstep(smoothstep(k / (R − 1))), dense near 0 and 1. */
export function zNodesFor(resolution: number): Float32Array {
  return Float32Array.from({ length: resolution }, (_, k) => smoothstep(smoothstep(k / (resolution - 1))));
}

/**
 * Builds the table by fitting every node (Gauss–Newton in CIELAB, each (x, y) column walked outward
 * from z-node R/5 reusing the neighbour's solution, as in the paper). Pure and deterministic.
 */
export function buildUpsampleTable(resolution: number = UPSAMPLE_METHOD.resolution): UpsampleTable {
  const R = resolution;
  const zNodes = zNodesFor(R);
  const coefficients = new Float32Array(3 * R * R * R * 3);
  const start = Math.floor(R / 5);
  const rgb: Rgb3 = [0, 0, 0];
  for (let l = 0; l < 3; l++) {
    for (let yi = 0; yi < R; yi++) {
      const y = yi / (R - 1);
      for (let xi = 0; xi < R; xi++) {
        const x = xi / (R - 1);
        const walk = (from: number, to: number, dir: number) => {
          let c: Coefficients = [0, 0, 0];
          for (let zi = from; zi !== to; zi += dir) {
            const z = zNodes[zi];
            rgb[l] = z;
            rgb[(l + 1) % 3] = x * z;
            rgb[(l + 2) % 3] = y * z;
            c = fitCoefficients(linearSrgbToXyz(rgb), c, { maxIterations: 40, tolerance: 1e-5 }).coefficients;
            const at = ((((l * R + zi) * R + yi) * R + xi) * 3);
            coefficients[at] = c[0];
            coefficients[at + 1] = c[1];
            coefficients[at + 2] = c[2];
          }
        };
        walk(start, R, 1);
        walk(start, -1, -1);
      }
    }
  }
  return { resolution: R, version: UPSAMPLE_METHOD.version, zNodes, coefficients };
}

/** Where a colour sits in the table: the lower corner node and the fractions along x, y, z. */
export interface TableCell {
  /** index of the lower corner node, ((l·R + zi)·R + yi)·R + xi */
  node: number;
  fx: number;
  fy: number;
  fz: number;
}

/**
 * Locates a linear sRGB colour (each channel clamped to 0..1) in the table. Writes into `cell` and
 * returns it. Trilinear weights over (x, y, z) reproduce the colour exactly when the eight corner
 * nodes are blended (the node colours are (z, x·z, y·z), which trilinear interpolation preserves).
 */
export function locateCell(table: UpsampleTable, r: number, g: number, b: number, cell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 }): TableCell {
  const R = table.resolution;
  const zn = table.zNodes;
  r = r < 0 ? 0 : r > 1 ? 1 : r;
  g = g < 0 ? 0 : g > 1 ? 1 : g;
  b = b < 0 ? 0 : b > 1 ? 1 : b;
  let l: number;
  let z: number;
  let u: number;
  let v: number;
  if (r >= g && r >= b) {
    l = 0;
    z = r;
    u = g;
    v = b;
  } else if (g >= b) {
    l = 1;
    z = g;
    u = b;
    v = r;
  } else {
    l = 2;
    z = b;
    u = r;
    v = g;
  }
  const x = z > 0 ? u / z : 0;
  const y = z > 0 ? v / z : 0;
  let lo = 0;
  let hi = R - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (zn[mid] <= z) lo = mid;
    else hi = mid;
  }
  const zi = Math.min(lo, R - 2);
  const xs = x * (R - 1);
  const ys = y * (R - 1);
  const xi = Math.min(Math.floor(xs), R - 2);
  const yi = Math.min(Math.floor(ys), R - 2);
  cell.node = ((l * R + zi) * R + yi) * R + xi;
  cell.fx = xs - xi;
  cell.fy = ys - yi;
  cell.fz = Math.min(1, Math.max(0, (z - zn[zi]) / (zn[zi + 1] - zn[zi])));
  return cell;
}

/**
 * Trilinear interpolation at `cell` of a per-node quantity stored as values[node·stride + offset]
 * (the coefficients: stride 3; a per-node medium exposure: stride 1).
 */
export function interpolateAtCell(table: UpsampleTable, values: ArrayLike<number>, stride: number, offset: number, cell: TableCell): number {
  const R = table.resolution;
  const sx = stride;
  const sy = R * stride;
  const sz = R * R * stride;
  const p = cell.node * stride + offset;
  const { fx, fy, fz } = cell;
  const c00 = values[p] * (1 - fx) + values[p + sx] * fx;
  const c01 = values[p + sy] * (1 - fx) + values[p + sy + sx] * fx;
  const c10 = values[p + sz] * (1 - fx) + values[p + sz + sx] * fx;
  const c11 = values[p + sz + sy] * (1 - fx) + values[p + sz + sy + sx] * fx;
  return (c00 * (1 - fy) + c01 * fy) * (1 - fz) + (c10 * (1 - fy) + c11 * fy) * fz;
}

const lookupCell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 };

/**
 * Coefficients for a linear sRGB colour (channels clamped to 0..1) by trilinear interpolation of the
 * table's coefficients. Writes into `out` and returns it.
 */
export function lookupCoefficients(table: UpsampleTable, r: number, g: number, b: number, out: Coefficients = [0, 0, 0]): Coefficients {
  locateCell(table, r, g, b, lookupCell);
  for (let c = 0; c < 3; c++) out[c] = interpolateAtCell(table, table.coefficients, 3, c, lookupCell);
  return out;
}

/** The table as bytes (layout in the header comment), for the cache file and the browser. */
export function encodeUpsampleTable(table: UpsampleTable): Uint8Array {
  const n = table.zNodes.length + table.coefficients.length;
  const buf = new ArrayBuffer(12 + 4 * n);
  const view = new DataView(buf);
  for (let i = 0; i < 4; i++) view.setUint8(i, MAGIC.charCodeAt(i));
  view.setUint32(4, table.resolution, true);
  view.setUint32(8, table.version, true);
  let o = 12;
  for (const v of table.zNodes) {
    view.setFloat32(o, v, true);
    o += 4;
  }
  for (const v of table.coefficients) {
    view.setFloat32(o, v, true);
    o += 4;
  }
  return new Uint8Array(buf);
}

/** Reads bytes written by `encodeUpsampleTable`; throws on a wrong magic, size or version. */
export function decodeUpsampleTable(bytes: Uint8Array, expectVersion: number = UPSAMPLE_METHOD.version): UpsampleTable {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.byteLength < 12) throw new Error('upsample table: too short');
  const magic = String.fromCharCode(view.getUint8(0), view.getUint8(1), view.getUint8(2), view.getUint8(3));
  if (magic !== MAGIC) throw new Error('upsample table: wrong magic');
  const R = view.getUint32(4, true);
  const version = view.getUint32(8, true);
  if (version !== expectVersion) throw new Error(`upsample table: version ${version}, expected ${expectVersion}`);
  const nz = R;
  const nc = 3 * R * R * R * 3;
  if (bytes.byteLength !== 12 + 4 * (nz + nc)) throw new Error('upsample table: wrong size');
  const zNodes = new Float32Array(nz);
  const coefficients = new Float32Array(nc);
  let o = 12;
  for (let i = 0; i < nz; i++, o += 4) zNodes[i] = view.getFloat32(o, true);
  for (let i = 0; i < nc; i++, o += 4) coefficients[i] = view.getFloat32(o, true);
  return { resolution: R, version, zNodes, coefficients };
}
