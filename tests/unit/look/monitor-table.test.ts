/**
 * Monitoring tables (shared/look/monitor-table.ts): the cube and CLF files of a look built here are read
 * back and checked against the engine, computed independently in this file for each node colour:
 * greyOfStops(tone table, pixelStops(photo model, srgbDecode(i / (N − 1)) per axis)).
 * The look is a deep red lens filter on a panchromatic medium under tungsten, so pure red reads light and
 * pure blue nearly black: a table with its red and blue axes swapped fails the checks.
 * Expected: N³ entries, each equal to the engine's grey to the files' 6 decimals (tolerance 5e-7 + float
 * slack, from the writers' MONITOR_TABLE_DECIMALS = 6), in the order each format prescribes (cube: red
 * fastest, as the format's published description says; CLF 3.0: blue fastest, S-2014-006 §LUT3D).
 */
import { describe, expect, it } from 'vitest';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { greyOfStops } from '../../../shared/look/tone-curve-table';
import { photoToneModel, pixelStops, type PhotoToneModel } from '../../../shared/photo/look-photo-model';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';
import { srgbDecode } from '../../../shared/spectral/colour';
import { monitorTable, monitorTableFileName, monitorTableQuerySchema, writeClf, writeCube, xmlEscape } from '../../../shared/look/monitor-table';
import { upsampleTable } from '../spectral/fixtures';

/** the files' rounding: 6 decimals (half of 1e-6), plus float slack */
const TOL = 5.1e-7;
const N = 17;
/** a name that must be escaped in XML and cleaned for the cube's TITLE */
const NAME = 'Red <590> & "deep" \'test\'\nlook';

const tone = { developmentStops: 0, ratingStops: 0, printGrade: 2, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 };
const spectra: LookSpectra = {
  bareLight: resolveLight({ id: 'tungsten-3200' }),
  filters: [{ spectrum: resolveFilter({ id: 'red-590' }), on: 'lens' }],
  medium: resolveMedium({ id: 'panchromatic' }),
  mediumToneId: 'medium.panchromatic',
  tone,
  key: null,
};

let model: PhotoToneModel | null = null;
function lookModel(): PhotoToneModel {
  model ??= photoToneModel(composeLook(spectra), upsampleTable());
  return model;
}

/** The engine's grey of the node colour (ri, gi, bi) of an n³ cube, computed here without the module. */
function engineGrey(m: PhotoToneModel, n: number, ri: number, gi: number, bi: number): number {
  const lin = (i: number) => srgbDecode(i / (n - 1));
  return greyOfStops(m.tone, pixelStops(m, lin(ri), lin(gi), lin(bi)));
}

/** Reads a cube file: its size and its entries in file order. */
function parseCube(text: string): { size: number; title: string; comments: string[]; rows: number[][] } {
  let size = 0;
  let title = '';
  const comments: string[] = [];
  const rows: number[][] = [];
  for (const line of text.split('\n')) {
    const t = line.trim();
    if (!t) continue;
    if (t.startsWith('#')) comments.push(t);
    else if (t.startsWith('TITLE')) title = t;
    else if (t.startsWith('LUT_3D_SIZE')) size = Number(t.split(/\s+/)[1]);
    else if (/^DOMAIN_(MIN|MAX)\s/.test(t)) continue;
    else {
      expect(rows.length === 0 || size > 0, 'data after LUT_3D_SIZE').toBe(true);
      const v = t.split(/\s+/).map(Number);
      expect(v.length).toBe(3);
      rows.push(v);
    }
  }
  return { size, title, comments, rows };
}

/** Reads a CLF file (regular expressions, no DOM): attributes and the LUT3D's entries in file order. */
function parseClf(text: string) {
  const pl = /<ProcessList\s([^>]*)>/.exec(text);
  const lut = /<LUT3D\s([^>]*)>/.exec(text);
  const arr = /<Array dim="(\d+) (\d+) (\d+) (\d+)">([\s\S]*?)<\/Array>/.exec(text);
  if (!pl || !lut || !arr) throw new Error('not a CLF ProcessList with a LUT3D Array');
  const attrs = (s: string) => Object.fromEntries([...s.matchAll(/(\w+)="([^"]*)"/g)].map((m) => [m[1], m[2]]));
  const nums = arr[5].trim().split(/\s+/).map(Number);
  const rows: number[][] = [];
  for (let i = 0; i < nums.length; i += 3) rows.push(nums.slice(i, i + 3));
  return {
    processList: attrs(pl[1]),
    lut3d: attrs(lut[1]),
    dim: [arr[1], arr[2], arr[3], arr[4]].map(Number),
    rows,
    tags: ['Description', 'InputDescriptor', 'OutputDescriptor'].map((t) => new RegExp(`<${t}>([^<]*)</${t}>`).exec(text)?.[1]),
  };
}

/** Well-formedness, roughly: no raw & or < in text, every open tag closed in order. */
function checkTags(text: string) {
  const body = text.replace(/^<\?xml[^>]*\?>/, '');
  expect(/&(?!(amp|lt|gt|quot|apos);)/.test(body), 'a raw & in the XML').toBe(false);
  const stack: string[] = [];
  for (const m of body.matchAll(/<(\/?)([A-Za-z][\w-]*)((?:\s+\w+="[^"<]*")*)\s*(\/?)>/g)) {
    if (m[4]) continue;
    if (m[1]) expect(stack.pop()).toBe(m[2]);
    else stack.push(m[2]);
  }
  expect(stack).toEqual([]);
  // nothing that looks like a tag is left unmatched (a raw < in text would be)
  expect(body.replace(/<(\/?)([A-Za-z][\w-]*)((?:\s+\w+="[^"<]*")*)\s*(\/?)>/g, '').includes('<')).toBe(false);
}

describe('monitoring tables', () => {
  const meta = { lookName: NAME, id: 'test-look-1', app: 'Grisaille' };

  it('the look reads red and blue very differently (so a swapped axis would show)', () => {
    const m = lookModel();
    const red = engineGrey(m, N, N - 1, 0, 0);
    const blue = engineGrey(m, N, 0, 0, N - 1);
    expect(red - blue).toBeGreaterThan(0.3);
  });

  it('cube: size, line count, red fastest, every entry the engine’s grey of its node', () => {
    const m = lookModel();
    const text = writeCube(monitorTable(m, N), meta);
    const cube = parseCube(text);
    expect(cube.size).toBe(N);
    expect(cube.rows.length).toBe(N ** 3);
    expect(cube.title).toBe(`TITLE "Red <590> & 'deep' 'test' look"`);
    const said = cube.comments.join('\n');
    expect(said).toMatch(/sRGB-encoded RGB per IEC 61966-2-1/);
    expect(said).toMatch(/domain 0\.\.1/);
    expect(said).toMatch(/Grisaille/);
    expect(said).toContain('Red <590>');
    expect(text).toMatch(/^DOMAIN_MIN 0 0 0$/m);
    expect(text).toMatch(/^DOMAIN_MAX 1 1 1$/m);
    let worst = 0;
    for (let bi = 0; bi < N; bi++)
      for (let gi = 0; gi < N; gi++)
        for (let ri = 0; ri < N; ri++) {
          const row = cube.rows[ri + N * gi + N * N * bi];
          const want = engineGrey(m, N, ri, gi, bi);
          expect(row[0]).toBe(row[1]);
          expect(row[1]).toBe(row[2]);
          worst = Math.max(worst, Math.abs(row[0] - want));
        }
    expect(worst).toBeLessThanOrEqual(TOL);
    // the decimals written: six
    expect(cube.rows.length && /^\d\.\d{6} /.test(text.split('\n').find((l) => /^\d/.test(l))!)).toBe(true);
  });

  it('CLF 3.0: a ProcessList with one 32f LUT3D, blue fastest, every entry the engine’s grey, the name escaped', () => {
    const m = lookModel();
    const text = writeClf(monitorTable(m, N), meta);
    checkTags(text);
    const clf = parseClf(text);
    expect(clf.processList.compCLFversion).toBe('3.0');
    expect(clf.processList.id).toBe('test-look-1');
    expect(clf.processList.name).toBe('Red &lt;590&gt; &amp; &quot;deep&quot; &apos;test&apos; look');
    expect(clf.lut3d.inBitDepth).toBe('32f');
    expect(clf.lut3d.outBitDepth).toBe('32f');
    expect(clf.dim).toEqual([N, N, N, 3]);
    expect(clf.rows.length).toBe(N ** 3);
    expect(clf.tags[1]).toMatch(/sRGB-encoded RGB per IEC 61966-2-1/);
    expect(clf.tags.every((t) => t !== undefined && t.length > 0)).toBe(true);
    let worst = 0;
    for (let ri = 0; ri < N; ri++)
      for (let gi = 0; gi < N; gi++)
        for (let bi = 0; bi < N; bi++) {
          const row = clf.rows[bi + N * gi + N * N * ri];
          expect(row[0]).toBe(row[2]);
          worst = Math.max(worst, Math.abs(row[0] - engineGrey(m, N, ri, gi, bi)));
        }
    expect(worst).toBeLessThanOrEqual(TOL);
  });

  it('the two files hold the same table in their two orders', () => {
    const t = monitorTable(lookModel(), N);
    const cube = parseCube(writeCube(t, meta)).rows;
    const clf = parseClf(writeClf(t, meta)).rows;
    // pure red and pure blue land at different places of the two files
    expect(cube[N - 1][0]).toBe(clf[(N - 1) * N * N][0]);
    expect(cube[(N - 1) * N * N][0]).toBe(clf[N - 1][0]);
    expect(cube[N - 1][0]).not.toBeCloseTo(cube[(N - 1) * N * N][0], 2);
  });

  it('the query, the file name and the escaping', () => {
    expect(monitorTableQuerySchema.parse({})).toEqual({ format: 'cube', size: 33 });
    expect(monitorTableQuerySchema.parse({ format: 'clf', size: '65' })).toEqual({ format: 'clf', size: 65 });
    for (const bad of [{ format: 'csp' }, { size: '16' }, { size: '66' }, { size: '33.5' }, { size: 'big' }])
      expect(monitorTableQuerySchema.safeParse(bad).error?.issues[0].path).toEqual([Object.keys(bad)[0]]);
    expect(monitorTableFileName(NAME, 'cube', 33)).toBe('red-590-deep-test-look-33.cube');
    expect(monitorTableFileName('"; rm -rf /', 'clf', 17)).toBe('rm-rf-17.clf');
    expect(monitorTableFileName('', 'clf', 17)).toBe('look-17.clf');
    expect(xmlEscape('a & <b>')).toBe('a &amp; &lt;b&gt;');
  });
});
