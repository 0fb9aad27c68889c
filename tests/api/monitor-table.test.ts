/**
 * GET /api/productions/:id/looks/:lookId/lut: a look as a monitoring table (cube or CLF) for download.
 * The table is read back and interpolated trilinearly (as a monitor does) at each colour swatch's hex; the
 * result is compared with the grey the board gives that swatch (GET …/boards/:id/tones `grey`, 0..255),
 * through every demo look and a deep red filter look made here, on the demo boards and a board of colours
 * made here (primaries, secondaries and pseudo-random colours).
 *
 * Allowed difference, in 8-bit codes: the board's grey is rounded to a whole code (up to 0.5), plus the
 * table's interpolation error between nodes, which is largest where the grey bends fastest across a cell:
 * saturated colours near the cube's surface through a deep filter. Measured by this engine over 20,000
 * pseudo-random 8-bit colours against the exact per-colour grey (no rounding), tungsten + panchromatic:
 * deep red 590 nm filter 33³ worst 1.42 (mean 0.043), 65³ worst 0.51 (mean 0.011); cyan 530 nm 33³ 0.32,
 * 65³ 0.10; no filter 33³ 0.20, 65³ 0.05. The limits are rounding + that worst + a little headroom; the
 * median stays near the rounding's own mean (0.25).
 */
import { random } from '../unit/spectral/fixtures';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import type { BoardTones } from '../../shared/schemas/board';

/** board rounding 0.5 + 33³ interpolation (worst measured 1.42, deep red filter) + headroom, codes */
const TOL_CODES_33 = 2.5;
/** board rounding 0.5 + 65³ interpolation (worst measured 0.51) + headroom, codes */
const TOL_CODES_65 = 1.25;
/** the median over all swatches and looks: about the rounding's mean (0.25) plus a little, codes */
const TOL_MEDIAN_CODES = 0.5;

let t: TestApp;
let owner: Agent;
let viewer: Agent;
let base: string;

beforeAll(async () => {
  ({ t, base, as: { owner, viewer } } = await startDemoAs({ owner: 'camera', viewer: 'lab' }));
});
afterAll(async () => t?.close());

/** A cube file's size and greys (first value of each line), red fastest. */
function readCube(text: string): { n: number; v: Float64Array } {
  const lines = text.split('\n');
  const n = Number(lines.find((l) => l.startsWith('LUT_3D_SIZE'))!.split(/\s+/)[1]);
  const data = lines.filter((l) => /^[-\d.]/.test(l));
  expect(data.length).toBe(n ** 3);
  return { n, v: Float64Array.from(data, (l) => Number(l.split(/\s+/)[0])) };
}

/** Trilinear interpolation of a red-fastest table at sRGB-encoded (r, g, b) in 0..1. */
function trilinear({ n, v }: { n: number; v: Float64Array }, r: number, g: number, b: number): number {
  const d = n - 1;
  const at = (x: number) => {
    const p = Math.min(Math.max(x, 0), 1) * d;
    const i = Math.min(Math.floor(p), d - 1);
    return [i, p - i] as const;
  };
  const [x0, fx] = at(r);
  const [y0, fy] = at(g);
  const [z0, fz] = at(b);
  const idx = (x: number, y: number, z: number) => v[x + n * (y + n * z)];
  let s = 0;
  for (const [dx, wx] of [[0, 1 - fx], [1, fx]] as const)
    for (const [dy, wy] of [[0, 1 - fy], [1, fy]] as const)
      for (const [dz, wz] of [[0, 1 - fz], [1, fz]] as const) s += wx * wy * wz * idx(x0 + dx, y0 + dy, z0 + dz);
  return s;
}

const hexRgb = (hex: string) => [1, 3, 5].map((k) => parseInt(hex.slice(k, k + 2), 16) / 255) as [number, number, number];

describe('monitoring tables over the API', () => {
  let redLookId = 0;

  it('a viewer downloads a cube: text/plain, a safe file name from the look, 33³ by default', async () => {
    const r0 = await owner.post(`${base}/looks`).send({
      name: 'Deep red / "test" <look>', notes: '', light: { source: { id: 'tungsten-3200' } },
      filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }], medium: { source: { id: 'panchromatic' } },
    });
    expect(r0.status).toBe(201);
    redLookId = r0.body.look.id;
    const r = await viewer.get(`${base}/looks/${redLookId}/lut`).buffer(true);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^text\/plain/);
    expect(r.headers['content-disposition']).toBe('attachment; filename="deep-red-test-look-33.cube"');
    const text = r.text;
    expect(text).toMatch(/^LUT_3D_SIZE 33$/m);
    expect(text).toMatch(/sRGB-encoded RGB per IEC 61966-2-1/);
    expect(readCube(text).n).toBe(33);
  });

  it('a CLF download: application/xml, a ProcessList 3.0 with a 65³ LUT3D, the name escaped', async () => {
    const r = await viewer.get(`${base}/looks/${redLookId}/lut?format=clf&size=65`).buffer(true);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^application\/xml/);
    expect(r.headers['content-disposition']).toBe('attachment; filename="deep-red-test-look-65.clf"');
    const text = r.text;
    expect(text).toMatch(/<ProcessList compCLFversion="3\.0" id="[^"]+"/);
    expect(text).toContain('name="Deep red / &quot;test&quot; &lt;look&gt;"');
    expect(text).toMatch(/<LUT3D [^>]*inBitDepth="32f" outBitDepth="32f"/);
    const arr = /<Array dim="65 65 65 3">([\s\S]*?)<\/Array>/.exec(text);
    expect(arr).not.toBeNull();
    expect(arr![1].trim().split(/\s+/).length).toBe(65 ** 3 * 3);
  });

  it('answers 400 naming format or size, and 404 for a look that is not in the production', async () => {
    for (const [q, field] of [['format=csp', 'format'], ['size=16', 'size'], ['size=66', 'size'], ['size=33.5', 'size'], ['size=x', 'size'], ['format=cube&size=0', 'size']] as const) {
      const r = await viewer.get(`${base}/looks/${redLookId}/lut?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.field, q).toBe(field);
      expect(r.body.error.message, q).toMatch(new RegExp(field));
    }
    expect((await viewer.get(`${base}/looks/999999/lut`)).status).toBe(404);
  });

  it('the table interpolated at a swatch’s colour gives the board’s grey, within the interpolation error', async () => {
    // a board of colours: primaries, secondaries, greys and pseudo-random colours
    const rnd = random(13);
    const hexes = ['#ff0000', '#00ff00', '#0000ff', '#ffff00', '#00ffff', '#ff00ff', '#ffffff', '#000000', '#808080', '#b3262e', '#2f5d8a'];
    for (let i = 0; i < 40; i++) hexes.push(`#${[0, 1, 2].map(() => Math.floor(rnd() * 256).toString(16).padStart(2, '0')).join('')}`);
    const ids: number[] = [];
    for (const [i, hex] of hexes.entries()) {
      const s = await owner.post(`${base}/swatches`).send({ name: `lut ${i}`, origin: { type: 'colour', colour: { space: 'hex', hex } } });
      expect(s.status).toBe(201);
      ids.push(s.body.swatch.id);
    }
    const looks = (await viewer.get(`${base}/looks`)).body.looks as { id: number; name: string }[];
    const mine = await owner.post(`${base}/boards`).send({ name: 'Monitoring table check', swatchIds: ids, lookIds: [redLookId] });
    expect(mine.status).toBe(201);
    const boards = (await viewer.get(`${base}/boards`)).body.boards as { id: number }[];
    const swatches = (await viewer.get(`${base}/swatches`)).body.swatches as { id: number; hex: string; origin: { type: string }; lightStops: number }[];
    // colour swatches lit as the key: the estimate of their hex is what the table holds
    const colour = new Map(swatches.filter((s) => s.origin.type === 'colour' && s.lightStops === 0).map((s) => [s.id, s.hex]));

    const diffs: Record<33 | 65, number[]> = { 33: [], 65: [] };
    const worst: Record<33 | 65, { d: number; what: string }> = { 33: { d: 0, what: '' }, 65: { d: 0, what: '' } };
    const lookIds = looks.map((l) => l.id);
    for (const size of [33, 65] as const) {
      const cubes = new Map<number, ReturnType<typeof readCube>>();
      for (const id of lookIds) cubes.set(id, readCube((await viewer.get(`${base}/looks/${id}/lut?size=${size}`).buffer(true)).text));
      for (const b of boards) {
        for (let k = 0; k < lookIds.length; k += 4) {
          const q = lookIds.slice(k, k + 4).join(',');
          const tones = (await viewer.get(`${base}/boards/${b.id}/tones?looks=${q}`)).body.tones as BoardTones;
          for (const lt of tones.looks) {
            for (const s of lt.tones) {
              const hex = colour.get(s.swatchId);
              if (!hex) continue;
              const d = Math.abs(trilinear(cubes.get(lt.lookId)!, ...hexRgb(hex)) * 255 - s.grey);
              diffs[size].push(d);
              if (d > worst[size].d) worst[size] = { d, what: `look ${lt.lookId} ${hex}: board ${s.grey}` };
            }
          }
        }
      }
    }
    const median = (a: number[]) => [...a].sort((x, y) => x - y)[a.length >> 1];
    console.log(`monitor table vs board: ${diffs[33].length} comparisons a size; 33³ worst ${worst[33].d.toFixed(2)} (${worst[33].what}), median ${median(diffs[33]).toFixed(3)}; 65³ worst ${worst[65].d.toFixed(2)} (${worst[65].what}), median ${median(diffs[65]).toFixed(3)} codes`);
    expect(diffs[33].length).toBeGreaterThan(100);
    expect(worst[33].d).toBeLessThanOrEqual(TOL_CODES_33);
    expect(worst[65].d).toBeLessThanOrEqual(TOL_CODES_65);
    expect(median(diffs[33])).toBeLessThanOrEqual(TOL_MEDIAN_CODES);
    expect(median(diffs[65])).toBeLessThanOrEqual(TOL_MEDIAN_CODES);
  });
});
