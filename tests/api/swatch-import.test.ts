/**
 * Swatches from a spectrophotometer file (CGATS.17 text; Argyll .sp): a costume member imports fabrics onto
 * the costume board, percent is detected and said, a bad line refuses the whole file naming the line and
 * field, another department's contributor is refused, the preview writes nothing, and a library curve can
 * come from a one-sample file. Sample names are invented.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { cgatsText, inventedFabric } from '../helpers/cgats';
import { Swatch } from '../../server/db/entities/swatch.entity';
import { Board } from '../../server/db/entities/board.entity';
import { MAX_BOARD_SWATCHES, type BoardView } from '../../shared/schemas/board';

/** Reflectance of the flat grey sample, written in the file as 18 (percent); Zone V middle grey (common practice). */
const GREY_PERCENT = 18;
/** Default tolerance of this file (reflectance, fraction): 6-decimal storage. */
const TOL = 1e-6;

let t: TestApp;
let base: string;
let costume: Agent;
let makeup: Agent;
let gaffer: Agent;
let costumeBoard: BoardView;
let makeupBoard: BoardView;
const count = () => t.ctx.ds.getRepository(Swatch).count();

const nm = Array.from({ length: 31 }, (_, i) => 400 + 10 * i); // 400–700 nm at 10 nm
/** Four invented fabrics in percent (no SPECTRAL_NORM: the reader must detect percent from the values). */
const FABRICS = cgatsText(
  ['ORIGINATOR "Invented costume workroom"', 'DESCRIPTOR "Fabric swatches for the test (invented)"', 'CREATED "2026-11-30"'],
  nm,
  [
    ['F1', 'Wool coat, bottle green', inventedFabric(nm, 4, 18, 530)],
    ['F2', 'Velvet waistcoat, wine', inventedFabric(nm, 3, 30, 700)],
    ['F3', 'Shawl, faded blue', inventedFabric(nm, 8, 25, 450)],
    ['F4', 'Grey flannel (flat)', nm.map(() => String(GREY_PERCENT))],
  ],
);
/** The line of each set above (1-based). */
const LINE_OF_F3 = 13;

const upload = (a: Agent, url: string, text: string, fields: Record<string, string> = {}, name = 'fabrics.cgats') => {
  const req = a.post(url);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('file', Buffer.from(text, 'utf8'), { filename: name, contentType: 'text/plain' });
};

beforeAll(async () => {
  ({ t, base, as: { costume, makeup, gaffer } } = await startDemoAs({ costume: 'costume', makeup: 'makeup', gaffer: 'gaffer' }));
  const boards: BoardView[] = (await costume.get(`${base}/boards`)).body.boards;
  costumeBoard = boards.find((b) => b.department === 'costume')!;
  makeupBoard = boards.find((b) => b.department === 'makeup')!;
});
afterAll(async () => t?.close());

describe('the costume member imports a fabric file onto the costume board', () => {
  it('previews it without writing: names, hex, points, percent detected and said', async () => {
    const before = await count();
    const r = await upload(costume, `${base}/swatches/import/preview`, FABRICS, { boardId: String(costumeBoard.id) });
    expect(r.status).toBe(200);
    expect(r.body.preview).toMatchObject({ fileType: 'CGATS.17', count: 4 });
    expect(r.body.preview.assumption).toMatch(/percent/);
    expect(r.body.preview.samples[0]).toMatchObject({ name: 'Wool coat, bottle green', points: 31, firstNm: 400, lastNm: 700 });
    expect(r.body.preview.samples[0].hex).toMatch(/^#[0-9a-f]{6}$/);
    expect(await count()).toBe(before);
  });

  it('adds every sample as a measured swatch on the board, percent read as percent', async () => {
    const before = await count();
    const r = await upload(costume, `${base}/swatches/import`, FABRICS, { boardId: String(costumeBoard.id) });
    expect(r.status).toBe(201);
    expect(r.body.swatches).toHaveLength(4);
    expect(await count()).toBe(before + 4);
    for (const s of r.body.swatches) {
      expect(s).toMatchObject({ department: 'costume', spectrum: 'measured', origin: { type: 'measured', basis: 'percent', fileName: 'fabrics.cgats', points: 31 } });
    }
    const grey = r.body.swatches[3];
    expect(grey.name).toBe('Grey flannel (flat)');
    for (const [, v] of grey.reflectance) expect(Math.abs(v - GREY_PERCENT / 100)).toBeLessThan(TOL);
    expect(grey.notes).toMatch(/fabrics\.cgats.*line 14.*percent/);
    const board = (await costume.get(`${base}/boards/${costumeBoard.id}`)).body.board as BoardView;
    for (const s of r.body.swatches) expect(board.swatchIds).toContain(s.id);
  });

  it('reads an Argyll .sp file (one spectrum, SPECTRAL_NORM 1) as one swatch in the importer\'s department', async () => {
    const sp = ['SPECT', 'KEYWORD "SPECTRAL_BANDS"', 'SPECTRAL_BANDS "4"', 'KEYWORD "SPECTRAL_START_NM"', 'SPECTRAL_START_NM "380.0"', 'KEYWORD "SPECTRAL_END_NM"', 'SPECTRAL_END_NM "740.0"',
      'KEYWORD "SPECTRAL_NORM"', 'SPECTRAL_NORM "1.0"', 'NUMBER_OF_FIELDS 4', 'BEGIN_DATA_FORMAT', 'SPEC_380 SPEC_500 SPEC_620 SPEC_740', 'END_DATA_FORMAT', 'NUMBER_OF_SETS 1', 'BEGIN_DATA', '0.2 0.3 0.4 0.5', 'END_DATA'].join('\n');
    const r = await upload(costume, `${base}/swatches/import`, sp, {}, 'lining.sp');
    expect(r.status).toBe(201);
    expect(r.body.swatches).toHaveLength(1);
    expect(r.body.swatches[0]).toMatchObject({ name: 'Sample 1', department: 'costume', origin: { basis: 'fraction', points: 4 } });
  });
});

describe('refusals write nothing', () => {
  it('a bad value on one line: 400 naming the line and field, no swatch saved', async () => {
    const before = await count();
    const bad = FABRICS.split('\n').map((l, i) => (i + 1 === LINE_OF_F3 ? l.replace(/ (\S+)$/, ' n/a') : l)).join('\n');
    const r = await upload(costume, `${base}/swatches/import`, bad, { boardId: String(costumeBoard.id) });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('file');
    expect(r.body.error.message).toMatch(new RegExp(`line ${LINE_OF_F3}, field SPECTRAL_NM700: "n/a" is not a number`));
    expect(await count()).toBe(before);
  });

  it('a value the engine refuses (negative reflectance): 400 naming the line and field, no swatch saved', async () => {
    const before = await count();
    const bad = FABRICS.split('\n').map((l, i) => (i + 1 === LINE_OF_F3 ? l.replace(/"Shawl, faded blue" \S+ (\S+)/, '"Shawl, faded blue" 9 -3') : l)).join('\n');
    const r = await upload(costume, `${base}/swatches/import`, bad);
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(new RegExp(`line ${LINE_OF_F3}, field SPECTRAL_NM410: .*negative`));
    expect(await count()).toBe(before);
  });

  it('a contributor of another department may not import onto the costume board (403)', async () => {
    const before = await count();
    const r = await upload(makeup, `${base}/swatches/import`, FABRICS, { boardId: String(costumeBoard.id) });
    expect(r.status).toBe(403);
    const p = await upload(makeup, `${base}/swatches/import/preview`, FABRICS, { department: 'costume' });
    expect(p.status).toBe(403);
    expect(await count()).toBe(before);
  });

  it('an editor may put another department\'s board; a board of no production is a 400; non-CGATS content is a 400', async () => {
    const ok = await upload(gaffer, `${base}/swatches/import/preview`, FABRICS, { boardId: String(makeupBoard.id) });
    expect(ok.status).toBe(200);
    const nope = await upload(costume, `${base}/swatches/import`, FABRICS, { boardId: '999999' });
    expect([nope.status, nope.body.error.field]).toEqual([400, 'boardId']);
    const csv = await upload(costume, `${base}/swatches/import`, '400,0.1\n500,0.2\n600,0.3\n', {}, 'table.csv');
    expect(csv.status).toBe(400);
    expect(csv.body.error.message).toMatch(/not a CGATS\.17 file/);
    const json = await costume.post(`${base}/swatches/import`).send({ file: FABRICS });
    expect(json.status).toBe(400);
    const binary = await costume.post(`${base}/swatches/import`).attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 1]), 'chart.png');
    expect(binary.status).toBe(400);
    expect(binary.body.error.message).toMatch(/not a text file/);
  });

  it('an import that would take a board past its limit is refused whole (400 naming boardId); one that fits lands', async () => {
    const made = await costume.post(`${base}/boards`).send({ name: 'Nearly full rail' });
    expect(made.status).toBe(201);
    const boardId: number = made.body.board.id;
    // fill it straight in the database to 3 short of the limit (through the API it would take 2,000 requests)
    const ds = t.ctx.ds;
    const board = await ds.getRepository(Board).findOneOrFail({ where: { id: boardId }, relations: { swatches: true, production: true } });
    const [some] = await ds.getRepository(Swatch).find({ where: { production: { id: board.production.id } }, take: 1 });
    const { id: _id, ...like } = some;
    const filler = await ds.getRepository(Swatch).save(
      Array.from({ length: MAX_BOARD_SWATCHES - 3 }, (_, i) => ds.getRepository(Swatch).create({ ...like, production: board.production, department: 'costume', name: `Filler ${i + 1}` })),
      { chunk: 200 },
    );
    board.swatches = filler;
    await ds.getRepository(Board).save(board);
    const before = await count();
    const r = await upload(costume, `${base}/swatches/import`, FABRICS, { boardId: String(boardId) });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('boardId');
    expect(r.body.error.message).toBe(`boardId: the board holds ${MAX_BOARD_SWATCHES - 3} swatches and a board takes at most ${MAX_BOARD_SWATCHES}; this file adds 4 (room for 3)`);
    expect(await count()).toBe(before);
    const three = cgatsText([], nm, [1, 2, 3].map((k) => [`L${k}`, `Lining ${k}`, inventedFabric(nm, 5 * k, 20, 500)] as [string, string, string[]]));
    const fits = await upload(costume, `${base}/swatches/import`, three, { boardId: String(boardId) });
    expect(fits.status).toBe(201);
    const after = await costume.get(`${base}/boards/${boardId}`);
    expect(after.body.board.swatchIds).toHaveLength(MAX_BOARD_SWATCHES);
  });
});

describe('a library curve from a CGATS file', () => {
  const ONE = ['CGATS.17', 'KEYWORD "SPECTRAL_NORM"', 'SPECTRAL_NORM 100', 'BEGIN_DATA_FORMAT', 'SAMPLE_NAME SPEC_380 SPEC_500 SPEC_600 SPEC_780', 'END_DATA_FORMAT', 'BEGIN_DATA', '"Pale gel (invented)" 80 70 60 50', 'END_DATA'].join('\n');
  const curve = (text: string, sample?: string) => ({ kind: 'filter', name: 'Pale gel from a file', origin: { type: 'table', basis: 'percent', table: { text, fileName: 'gel.cgats', ...(sample ? { sample } : {}) } } });

  it('one sample becomes a curve in the basis the user picks', async () => {
    const r = await gaffer.post(`${base}/curves`).send(curve(ONE));
    expect(r.status).toBe(201);
    expect(r.body.curve.source).toMatch(/CGATS\.17, sample "Pale gel \(invented\)"/);
    expect(r.body.curve.samples[0][1]).toBeCloseTo(0.8, 6);
  });

  it('several samples: refused naming them, unless one is chosen', async () => {
    const r = await gaffer.post(`${base}/curves`).send(curve(FABRICS));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/4 samples.*Wool coat, bottle green.*choose/);
    const ok = await gaffer.post(`${base}/curves`).send(curve(FABRICS, 'F4'));
    expect(ok.status).toBe(201);
    expect(ok.body.curve.samples[10][1]).toBeCloseTo(GREY_PERCENT / 100, 6);
  });
});
