/**
 * A board, its swatches and its looks as the tones read them, in plain SQL (issue 15): loading the swatches
 * as entities through the board's relation took 60–140 ms of the main thread for 2,000 swatches (TypeORM's
 * join of every column and its hydration), against about 6 ms here; and for a small board TypeORM's building
 * of each query was a tenth of the request's main-thread time under load. Parameters are always bound.
 *
 * The order is the board's swatches by ascending id: the order the relation gives too (SQLite reads the join
 * table through its primary key (boardId, swatchId), a covering index), written here explicitly.
 * A swatch's `origin` is read only when it has a stored reflectance, the one case the tones look at it
 * (swatch-spectra.ts `swatchSpectrum`).
 */
import type { EntityManager } from 'typeorm';
import type { Swatch } from '../../db/entities/swatch.entity';
import type { Look } from '../../db/entities/look.entity';
import { NotFoundError } from '../../errors';
import type { SwatchOrigin } from '../../../shared/schemas/swatch';

/** What the tones read of a stored swatch. */
export type ToneRow = Pick<Swatch, 'id' | 'name' | 'hex' | 'reflectance' | 'lightStops'> & { origin?: SwatchOrigin };

interface RawRow {
  id: number;
  name: string;
  hex: string;
  reflectance: string | null;
  origin: string | null;
  lightStops: number | null;
}

/** The swatches of board `boardId` (whose production the caller has checked), by ascending id. */
export async function boardSwatchRows(em: EntityManager, boardId: number): Promise<ToneRow[]> {
  const raw = (await em.query(
    `SELECT s."id" AS "id", s."name" AS "name", s."hex" AS "hex", s."reflectance" AS "reflectance",
       CASE WHEN s."reflectance" IS NULL THEN NULL ELSE s."origin" END AS "origin", s."lightStops" AS "lightStops"
     FROM "board_swatches" bs JOIN "swatches" s ON s."id" = bs."swatchId"
     WHERE bs."boardId" = ? ORDER BY bs."swatchId" ASC`,
    [boardId],
  )) as RawRow[];
  return raw.map((r) => ({
    id: r.id,
    name: r.name,
    hex: r.hex,
    reflectance: r.reflectance === null ? null : (JSON.parse(r.reflectance) as [number, number][]),
    ...(r.origin === null ? {} : { origin: JSON.parse(r.origin) as SwatchOrigin }),
    lightStops: r.lightStops ?? 0,
  }));
}

/** What the tones read of a board. */
export interface ToneBoard {
  id: number;
  lookIds: number[];
  mergeStops: number;
  mergeDeltaE: number;
}

/** Board `boardId` of production `productionId`, or NotFoundError('Board') (as in-production.ts `findInProduction`). */
export async function boardForTones(em: EntityManager, productionId: number, boardId: number): Promise<ToneBoard> {
  const [row] = (await em.query(`SELECT "id", "lookIds", "mergeStops", "mergeDeltaE" FROM "boards" WHERE "id" = ? AND "productionId" = ?`, [boardId, productionId])) as {
    id: number;
    lookIds: string;
    mergeStops: number;
    mergeDeltaE: number;
  }[];
  if (!row) throw new NotFoundError('Board');
  return { id: row.id, lookIds: JSON.parse(row.lookIds) as number[], mergeStops: row.mergeStops, mergeDeltaE: row.mergeDeltaE };
}

/** What the tones read of a look. */
export type ToneLookRow = Pick<Look, 'id' | 'name' | 'light' | 'filters' | 'medium' | 'tone'>;

/** The looks of production `productionId` among `ids` (those that are not in it are left out), in no set order. */
export async function looksForTones(em: EntityManager, productionId: number, ids: readonly number[]): Promise<ToneLookRow[]> {
  if (!ids.length) return [];
  const rows = (await em.query(`SELECT "id", "name", "light", "filters", "medium", "tone" FROM "looks" WHERE "productionId" = ? AND "id" IN (${ids.map(() => '?').join(', ')})`, [
    productionId,
    ...ids,
  ])) as { id: number; name: string; light: string; filters: string; medium: string; tone: string }[];
  return rows.map((r) => ({ id: r.id, name: r.name, light: JSON.parse(r.light), filters: JSON.parse(r.filters), medium: JSON.parse(r.medium), tone: JSON.parse(r.tone) }) as ToneLookRow);
}
