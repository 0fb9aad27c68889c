/**
 * The migration that gives swatches their own light (`lightStops`): on a fresh database it runs and the
 * column defaults to 0; on a database of the previous schema, existing swatches keep everything and read 0.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { DataSource } from 'typeorm';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource, entities, migrations } from '../../server/db/data-source';

const dirs: string[] = [];
const tempDb = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-migration-'));
  dirs.push(d);
  return path.join(d, 'app.sqlite');
};
afterAll(() => dirs.forEach((d) => fs.rmSync(d, { recursive: true, force: true })));

const columns = async (ds: DataSource) => (await ds.query(`PRAGMA table_info("swatches")`)) as { name: string; dflt_value: string | null; notnull: number }[];

describe('the swatch light migration', () => {
  it('runs on a fresh database: lightStops real, not null, default 0', async () => {
    const ds = createDataSource(tempDb());
    await ds.initialize();
    await ds.runMigrations();
    const col = (await columns(ds)).find((c) => c.name === 'lightStops');
    expect(col).toMatchObject({ notnull: 1 });
    expect(Number(col!.dflt_value?.replace(/[()]/g, ''))).toBe(0);
    expect(await ds.query(`SELECT COUNT(*) AS n FROM "migrations"`)).toEqual([{ n: migrations.length }]);
    await ds.destroy();
  });

  it('keeps existing swatches, which read 0 stops', async () => {
    const file = tempDb();
    const before = new DataSource({ type: 'better-sqlite3', database: file, entities: [], migrations: migrations.slice(0, -1) });
    await before.initialize();
    await before.runMigrations();
    await before.query(`INSERT INTO "productions"("name", "description") VALUES ('p', '')`);
    await before.query(`INSERT INTO "swatches"("department", "name", "notes", "origin", "hex", "reflectance", "productionId") VALUES ('art', 'Old wall', 'kept', '{"type":"colour","colour":{"space":"hex","hex":"#808080"}}', '#808080', NULL, 1)`);
    await before.destroy();
    const after = new DataSource({ type: 'better-sqlite3', database: file, entities, migrations });
    await after.initialize();
    await after.runMigrations();
    const rows = await after.query(`SELECT "name", "notes", "hex", "lightStops" FROM "swatches"`);
    expect(rows).toEqual([{ name: 'Old wall', notes: 'kept', hex: '#808080', lightStops: 0 }]);
    await after.destroy();
  });
});
