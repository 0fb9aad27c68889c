/**
 * The colour estimate, tabulated: for each node of a 3 × R³ grid over linear sRGB, the LHTSS reflectance of
 * the node's colour (lhtss.ts: the smoothest reflectance in (0, 1) with that colour under D65, Burns 2020).
 * A colour's estimate is the trilinear blend of its cell's eight node spectra (node-spectra.ts), which
 * reproduces it exactly. Parameters and source: data/upsample/method.json. The table is big (R = 32:
 * 98,304 spectra of 111 samples), so it is passed in by the caller: built by `buildUpsampleTable()` (a few
 * seconds) and cached by the server (server/services/upsample-table.ts); the browser fetches a compact
 * form (GET /api/library/upsample-table). Node spectra live on the estimate's grid (350–900 nm at 5 nm,
 * 111 samples, policy.ts) and are carried to the working grid by linear interpolation when used.
 *
 * Layout (as in Jakob & Hanika 2019, whose table layout this keeps): for a linear colour, l = index of its
 * largest channel, z = that channel, x = rgb[(l+1)%3] / z, y = rgb[(l+2)%3] / z. Nodes: x and y uniform on
 * 0..1; z at smoothstep(smoothstep(k / (R − 1))), dense near black and white. Node index
 * ((l·R + zi)·R + yi)·R + xi; its spectrum at spectra[node·111 …].
 *
 * Binary forms (little-endian), both starting: 4-byte magic; uint32 R; uint32 method version; uint32 grid
 * samples (111); float32 zNodes[R]; then
 *   "GSU2" float32 spectra[3·R³·111] (the server's cache: exact);
 *   "GSQ2" uint16 spectra quantised to 1/65535, each stored less its linear prediction from the two samples
 *          before it (mod 2¹⁶), which compresses better; the server sends it gzip-compressed (about 7 MB,
 *          for the browser's live preview).
 */
import methodJson from '../../data/upsample/method.json';
import { linearSrgbToXyz } from './colour';
import { tristimulusWeights } from './integrate';
import { lhtss, type ColourRows, type LhtssState } from './lhtss';
import { cieIlluminant } from './lights';
import { ESTIMATE_SIZE, weightsToEstimateGrid } from './policy';
import type { Rgb3 } from './types';

/** The tabulated estimate. */
export interface UpsampleTable {
  readonly resolution: number;
  readonly version: number;
  readonly zNodes: Float32Array;
  /** reflectance 0..1 of every node on the estimate's grid: node k's ESTIMATE_SIZE values from k·ESTIMATE_SIZE */
  readonly spectra: Float32Array;
}

/** Method parameters and published source of the table (data/upsample/method.json). */
export const UPSAMPLE_METHOD: { name: string; source: string; version: number; resolution: number } = methodJson;

function smoothstep(x: number): number {
  return x * x * (3 - 2 * x);
}

/** z nodes of a table of resolution R: smoothstep(smoothstep(k / (R − 1))), dense near 0 and 1. */
export function zNodesFor(resolution: number): Float32Array {
  return Float32Array.from({ length: resolution }, (_, k) => smoothstep(smoothstep(k / (resolution - 1))));
}

/** The colour rows of the estimate: CIE 1931 2° tristimulus weights of D65 (integrate.ts) on the estimate's grid. */
export function estimateRows(): ColourRows {
  const w = tristimulusWeights(cieIlluminant('D65'));
  return [weightsToEstimateGrid(w.x), weightsToEstimateGrid(w.y), weightsToEstimateGrid(w.z)];
}

/**
 * The estimate's reflectance of one linear sRGB colour (each 0..1), solved directly (no table): LHTSS from
 * `start` or from ρ = ½, so nodes reuse their neighbour's solution. Black is ρ = 0 and a colour the solver
 * cannot reach to 1e-9 (only the last steps next to pure white, where ρ → 1) is the flat reflectance of its
 * luminance, which is what LHTSS tends to there.
 */
export function estimateNode(rows: ColourRows, rgb: Rgb3, start?: LhtssState): { reflectance: Float64Array; state?: LhtssState } {
  if (rgb[0] <= 0 && rgb[1] <= 0 && rgb[2] <= 0) return { reflectance: new Float64Array(ESTIMATE_SIZE) };
  const xyz = linearSrgbToXyz(rgb);
  let r = lhtss(rows, xyz, start);
  if (!r.converged && start) r = lhtss(rows, xyz);
  if (r.converged) return { reflectance: r.reflectance, state: r.state };
  let white = 0;
  for (let i = 0; i < ESTIMATE_SIZE; i++) white += rows[1][i];
  return { reflectance: new Float64Array(ESTIMATE_SIZE).fill(Math.min(1, Math.max(0, xyz[1] / white))) };
}

/**
 * Builds the table: every node's estimate, each (x, y) column walked outward from z-node R/5 reusing the
 * neighbour's solution (as Jakob & Hanika walk theirs). Pure and deterministic.
 */
export function buildUpsampleTable(resolution: number = UPSAMPLE_METHOD.resolution): UpsampleTable {
  const R = resolution;
  const zNodes = zNodesFor(R);
  const spectra = new Float32Array(3 * R * R * R * ESTIMATE_SIZE);
  const rows = estimateRows();
  const start = Math.floor(R / 5);
  const rgb: Rgb3 = [0, 0, 0];
  for (let l = 0; l < 3; l++) {
    for (let yi = 0; yi < R; yi++) {
      const y = yi / (R - 1);
      for (let xi = 0; xi < R; xi++) {
        const x = xi / (R - 1);
        const walk = (from: number, to: number, dir: number) => {
          let state: LhtssState | undefined;
          for (let zi = from; zi !== to; zi += dir) {
            const z = zNodes[zi];
            rgb[l] = z;
            rgb[(l + 1) % 3] = x * z;
            rgb[(l + 2) % 3] = y * z;
            const e = estimateNode(rows, rgb, state);
            state = e.state;
            spectra.set(e.reflectance, (((l * R + zi) * R + yi) * R + xi) * ESTIMATE_SIZE);
          }
        };
        walk(start, R, 1);
        walk(start, -1, -1);
      }
    }
  }
  return { resolution: R, version: UPSAMPLE_METHOD.version, zNodes, spectra };
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


const HEADER = 16;

/** Whether this machine stores numbers little-endian (the binary forms are; a view needs no byte swapping). */
function littleEndian(): boolean {
  return new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;
}

/** The compact form stores each sample less its linear prediction from the two before it (smooth curves leave small numbers). */
function predict(i: number, p1: number, p2: number): number {
  return i === 0 ? 0 : i === 1 ? p1 : 2 * p1 - p2;
}

function writeHeader(view: DataView, magic: string, table: UpsampleTable): number {
  for (let i = 0; i < 4; i++) view.setUint8(i, magic.charCodeAt(i));
  view.setUint32(4, table.resolution, true);
  view.setUint32(8, table.version, true);
  view.setUint32(12, ESTIMATE_SIZE, true);
  let o = HEADER;
  for (const v of table.zNodes) {
    view.setFloat32(o, v, true);
    o += 4;
  }
  return o;
}

/** The table as bytes, exact ("GSU2", layout in the header comment): the server's cache file. */
export function encodeUpsampleTable(table: UpsampleTable): Uint8Array {
  const buf = new ArrayBuffer(HEADER + 4 * table.zNodes.length + 4 * table.spectra.length);
  const view = new DataView(buf);
  const o = writeHeader(view, 'GSU2', table);
  new Uint8Array(buf, o).set(new Uint8Array(table.spectra.buffer, table.spectra.byteOffset, table.spectra.byteLength));
  return new Uint8Array(buf);
}

/** The table as compact bytes ("GSQ2": 1/65535 steps, second differences along wavelength), for the browser. */
export function encodeUpsampleTableCompact(table: UpsampleTable): Uint8Array {
  const n = table.spectra.length;
  const buf = new ArrayBuffer(HEADER + 4 * table.zNodes.length + 2 * n);
  const view = new DataView(buf);
  let o = writeHeader(view, 'GSQ2', table);
  for (let k = 0; k < n; k += ESTIMATE_SIZE) {
    let p1 = 0;
    let p2 = 0;
    for (let i = 0; i < ESTIMATE_SIZE; i++, o += 2) {
      const q = Math.round(Math.min(1, Math.max(0, table.spectra[k + i])) * 65535);
      view.setUint16(o, (q - predict(i, p1, p2)) & 0xffff, true);
      p2 = p1;
      p1 = q;
    }
  }
  return new Uint8Array(buf);
}

/**
 * Reads bytes written by either encoder; throws on a wrong magic, size, grid or version. With `noCopy`, an
 * exact ("GSU2") table's spectra are a view on `bytes` (no copy: the server reads its 44 MB cache file
 * into shared memory once and keeps only that, which its render workers read too); otherwise they are copied.
 */
export function decodeUpsampleTable(bytes: Uint8Array, expectVersion: number = UPSAMPLE_METHOD.version, noCopy = false): UpsampleTable {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.byteLength < HEADER) throw new Error('upsample table: too short');
  const magic = String.fromCharCode(view.getUint8(0), view.getUint8(1), view.getUint8(2), view.getUint8(3));
  if (magic !== 'GSU2' && magic !== 'GSQ2') throw new Error('upsample table: wrong magic');
  const R = view.getUint32(4, true);
  const version = view.getUint32(8, true);
  if (version !== expectVersion) throw new Error(`upsample table: version ${version}, expected ${expectVersion}`);
  if (view.getUint32(12, true) !== ESTIMATE_SIZE) throw new Error('upsample table: another wavelength grid');
  const n = 3 * R * R * R * ESTIMATE_SIZE;
  const bytesPer = magic === 'GSU2' ? 4 : 2;
  if (bytes.byteLength !== HEADER + 4 * R + bytesPer * n) throw new Error('upsample table: wrong size');
  const zNodes = new Float32Array(R);
  let o = HEADER;
  for (let i = 0; i < R; i++, o += 4) zNodes[i] = view.getFloat32(o, true);
  if (magic === 'GSU2' && noCopy && (bytes.byteOffset + o) % 4 === 0 && littleEndian()) {
    return { resolution: R, version, zNodes, spectra: new Float32Array(bytes.buffer, bytes.byteOffset + o, n) };
  }
  // an exact table copied once (a fresh, aligned buffer); a compact one decoded
  if (magic === 'GSU2') return { resolution: R, version, zNodes, spectra: new Float32Array(bytes.buffer.slice(bytes.byteOffset + o, bytes.byteOffset + o + 4 * n)) };
  const spectra = new Float32Array(n);
  for (let k = 0; k < n; k += ESTIMATE_SIZE) {
    let p1 = 0;
    let p2 = 0;
    for (let i = 0; i < ESTIMATE_SIZE; i++, o += 2) {
      const q = (predict(i, p1, p2) + view.getUint16(o, true)) & 0xffff;
      spectra[k + i] = q / 65535;
      p2 = p1;
      p1 = q;
    }
  }
  return { resolution: R, version, zNodes, spectra };
}
