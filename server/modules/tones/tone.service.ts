import { In, type DataSource, type EntityManager } from 'typeorm';
import { findInProduction } from '../../db/in-production';
import { Board } from '../../db/entities/board.entity';
import { Look } from '../../db/entities/look.entity';
import { Swatch } from '../../db/entities/swatch.entity';
import { InvalidError } from '../../errors';
import type { BoardTones, LookTones } from '../../../shared/schemas/board';
import type { LookDefinition } from '../../../shared/schemas/look';
import { toneSettingsSchema } from '../../../shared/schemas/exposure';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { getUpsampleTable } from '../../services/upsample-table';
import { computePoolFor } from '../../services/compute-pool';
import { composeLook } from '../../../shared/look/compose-look';
import type { Curve } from '../../db/entities/curve.entity';
import { LruCache } from '../../services/cache';
import { loadCurves, lookSpectra, refsOfLook, resolveLook } from './look-resolve';
import { swatchSpectrum } from './swatch-spectra';
import type { ToneLook, ToneSwatch } from './board-tones';
import { lookTonesJob } from './look-tones.job';
import { pooledLookTones } from './pooled-tones';
import { prefillRanges, rangesJob } from './tone-ranges';
import { boardForTones, boardSwatchRows, looksForTones, type ToneRow } from './board-swatch-rows';

/** A look to compute with: a saved one, or an unsaved definition from the bench. */
export type LookInput = LookDefinition & { id: number; name: string };

/** A saved look as a definition; tone settings saved before a setting existed take its default. */
export function lookDefinition(l: Pick<Look, 'id' | 'name' | 'light' | 'filters' | 'medium' | 'tone'>): LookInput {
  return { id: l.id, name: l.name, light: l.light, filters: l.filters, medium: l.medium, tone: toneSettingsSchema.parse(l.tone ?? {}) };
}

/** Composed looks kept (a few productions' looks; each holds its light path and tone tables). */
const PIPELINES_KEPT = 200;
const pipelines = new LruCache<string, Pick<ToneLook, 'resolved' | 'composed'>>(PIPELINES_KEPT);
const tableIds = new WeakMap<UpsampleTable, number>();
let nextTableId = 1;

/** A number per upsample table object (one per data directory), for the key. */
function tableId(table: UpsampleTable): number {
  let id = tableIds.get(table);
  if (id === undefined) tableIds.set(table, (id = nextTableId++));
  return id;
}

/**
 * What a look's composition depends on, as one string: its stored definition (light, filters, medium,
 * tone settings), every production curve it names (kind, name, source and samples, or its absence, which
 * is an error), its key swatch as stored (colour, reflectance, origin) and the upsample table. The content
 * rather than `updatedAt`: SQLite's timestamps here are to the second, so two edits within one second
 * would share a key.
 */
function pipelineKey(l: LookInput, curves: Map<number, Curve>, key: Swatch | undefined, table: UpsampleTable): string {
  const curveParts = refsOfLook(l).map((r) => {
    if (r.curveId === undefined) return null;
    const c = curves.get(r.curveId);
    return c ? [c.id, c.kind, c.name, c.source, c.samples] : [r.curveId];
  });
  const keyPart = key ? [key.id, key.hex, key.reflectance, key.origin ?? null] : null;
  return JSON.stringify([l.light, l.filters, l.medium, l.tone, curveParts, keyPart, tableId(table)]);
}

/**
 * A look resolved and composed (shared/look/compose-look.ts), kept by what it depends on (`pipelineKey`),
 * so a look that has not changed is not composed again per request. Engine values are immutable, so the
 * kept ones are shared.
 */
function composedLook(l: LookInput, curves: Map<number, Curve>, key: Swatch | undefined, table: UpsampleTable): Pick<ToneLook, 'resolved' | 'composed' | 'pipelineKey'> {
  const k = pipelineKey(l, curves, key, table);
  let p = pipelines.get(k);
  if (!p) {
    const resolved = resolveLook(l, curves);
    const spectra = lookSpectra(resolved, l.tone, key ? swatchSpectrum(key, table).reflectance : null);
    p = { resolved, composed: composeLook(spectra, resolved) };
    pipelines.set(k, p);
  }
  return { ...p, pipelineKey: k };
}

/** Resolves looks (curves, key swatches) for tone computation, in one pass over the database. */
export async function prepareToneLooks(em: EntityManager, productionId: number, looks: LookInput[], table: UpsampleTable): Promise<ToneLook[]> {
  const curves = await loadCurves(em, productionId, looks.flatMap(refsOfLook));
  const keyIds = [...new Set(looks.map((l) => l.tone.keySwatchId).filter((x): x is number => x !== null))];
  const keys = keyIds.length ? await em.find(Swatch, { where: { id: In(keyIds), production: { id: productionId } } }) : [];
  const keyById = new Map(keys.map((k) => [k.id, k]));
  return looks.map((l) => {
    const key = l.tone.keySwatchId !== null ? keyById.get(l.tone.keySwatchId) : undefined;
    return { id: l.id, name: l.name, ...composedLook(l, curves, key, table) };
  });
}

export function toneSwatches(rows: readonly ToneRow[], table: UpsampleTable): ToneSwatch[] {
  return rows.map((s) => ({ id: s.id, name: s.name, ...swatchSpectrum(s, table), lightStops: s.lightStops ?? 0 }));
}

/**
 * Each look's tones of stored swatches (`rows`, in order), computed in the compute pool of the app that owns
 * `ds` (in place without one): the ranges they lack first (`prefillRanges`), then the tones (pooled-tones.ts).
 * For the services that tone swatches outside a board's route (the exposure sheet).
 */
export async function tonesInPool(ds: DataSource, looks: ToneLook[], rows: readonly ToneRow[], table: UpsampleTable, merge: { mergeStops: number; mergeDeltaE: number }): Promise<LookTones[]> {
  const pool = computePoolFor(ds);
  const swatches = toneSwatches(rows, table);
  await prefillRanges(pool, looks.map((l) => l.composed.path), swatches);
  return pooledLookTones(pool, table, looks, rows, swatches, merge, false);
}

/** A board's tones with each look's part either as an object or as its JSON text (computed in a thread). */
interface BoardParts<T> {
  boardId: number;
  mergeStops: number;
  mergeDeltaE: number;
  looks: T[];
  ms: number;
}

/**
 * Tones of boards and swatches through looks, computed on the server per request. The main thread reads
 * the database and composes the looks (kept, `composedLook`); the tones themselves (simulation, tone
 * pipeline, ranges, merges) are computed in the app's compute pool (pooled-tones.ts, look-tones.job.ts),
 * a large board's looks spread over its threads. The tone ranges a request lacks are computed first in the
 * pool too (tone-ranges.ts `prefillRanges`, one job per light path).
 */
export class ToneService {
  constructor(private ds: DataSource, private dataDir: string) {
    computePoolFor(ds)?.preload(rangesJob, lookTonesJob);
  }

  private table() {
    return getUpsampleTable(this.dataDir);
  }

  private get pool() {
    return computePoolFor(this.ds);
  }

  /** The ranges these tones need, computed off the main thread (kept for the composition that follows). */
  private prefill(looks: ToneLook[], swatches: ToneSwatch[]): Promise<void> {
    return prefillRanges(this.pool, looks.map((l) => l.composed.path), swatches);
  }

  /** Tones of stored swatches through looks, in the pool: each look's LookTones, or its JSON text. */
  private async tonesOf(looks: ToneLook[], rows: ToneRow[], table: UpsampleTable, merge: { mergeStops: number; mergeDeltaE: number }, json: true): Promise<string[]>;
  private async tonesOf(looks: ToneLook[], rows: ToneRow[], table: UpsampleTable, merge: { mergeStops: number; mergeDeltaE: number }, json: false): Promise<LookTones[]>;
  private async tonesOf(looks: ToneLook[], rows: ToneRow[], table: UpsampleTable, merge: { mergeStops: number; mergeDeltaE: number }, json: boolean): Promise<(LookTones | string)[]> {
    const swatches = toneSwatches(rows, table);
    await this.prefill(looks, swatches);
    return json ? pooledLookTones(this.pool, table, looks, rows, swatches, merge, true) : pooledLookTones(this.pool, table, looks, rows, swatches, merge, false);
  }

  private async boardParts<T extends LookTones | string>(productionId: number, boardId: number, q: { looks?: number[]; mergeStops?: number; mergeDeltaE?: number }, json: boolean): Promise<BoardParts<T>> {
    const em = this.ds.manager;
    const board = await boardForTones(em, productionId, boardId);
    const swatchRows = await boardSwatchRows(em, boardId);
    const lookIds = q.looks ?? board.lookIds;
    const rows = await looksForTones(em, productionId, lookIds);
    const byId = new Map(rows.map((l) => [l.id, l]));
    const missing = lookIds.find((id) => !byId.has(id));
    if (q.looks && missing !== undefined) throw new InvalidError(`looks: look ${missing} is not in this production`, 'looks');
    const looks = lookIds.filter((id) => byId.has(id)).map((id) => lookDefinition(byId.get(id)!));
    const table = await this.table();
    const t0 = performance.now();
    const mergeStops = q.mergeStops ?? board.mergeStops;
    const mergeDeltaE = q.mergeDeltaE ?? board.mergeDeltaE;
    const toneLooks = await prepareToneLooks(em, productionId, looks, table);
    const merge = { mergeStops, mergeDeltaE };
    const out = (json ? await this.tonesOf(toneLooks, swatchRows, table, merge, true) : await this.tonesOf(toneLooks, swatchRows, table, merge, false)) as T[];
    return { boardId, mergeStops, mergeDeltaE, looks: out, ms: performance.now() - t0 };
  }

  async boardTones(productionId: number, boardId: number, q: { looks?: number[]; mergeStops?: number; mergeDeltaE?: number }): Promise<BoardTones> {
    return this.boardParts<LookTones>(productionId, boardId, q, false);
  }

  /**
   * The route's answer `{ tones: BoardTones }` as JSON text, exactly as JSON.stringify would write it: each
   * look's part serialised in the compute thread that computed it, joined here.
   */
  async boardTonesJson(productionId: number, boardId: number, q: { looks?: number[]; mergeStops?: number; mergeDeltaE?: number }): Promise<string> {
    const p = await this.boardParts<string>(productionId, boardId, q, true);
    const head = JSON.stringify({ boardId: p.boardId, mergeStops: p.mergeStops, mergeDeltaE: p.mergeDeltaE });
    return `{"tones":${head.slice(0, -1)},"looks":[${p.looks.join(',')}],"ms":${JSON.stringify(p.ms)}}}`;
  }

  /** One swatch through every look of the production (merges are not computed for a single swatch). */
  async swatchTones(productionId: number, swatchId: number): Promise<{ swatchId: number; looks: LookTones[] }> {
    const em = this.ds.manager;
    const s = await findInProduction(em, Swatch, productionId, swatchId, 'Swatch');
    const looks = (await em.find(Look, { where: { production: { id: productionId } }, order: { id: 'ASC' } })).map(lookDefinition);
    const table = await this.table();
    const toneLooks = await prepareToneLooks(em, productionId, looks, table);
    return { swatchId, looks: await this.tonesOf(toneLooks, [s], table, { mergeStops: 0, mergeDeltaE: Infinity }, false) };
  }

  /** Tones of a board's swatches through one unsaved look (the bench while it is edited). */
  async unsavedLookTones(productionId: number, look: LookInput, boardId: number): Promise<{ tones: LookTones; swatches: { id: number; name: string; hex: string; estimated: boolean }[] }> {
    const em = this.ds.manager;
    const board = await em.findOne(Board, { where: { id: boardId, production: { id: productionId } } });
    if (!board) throw new InvalidError(`boardId: board ${boardId} is not in this production`, 'boardId');
    const swatchRows = await boardSwatchRows(em, boardId);
    const table = await this.table();
    const [toneLook] = await prepareToneLooks(em, productionId, [look], table);
    const [tones] = await this.tonesOf([toneLook], swatchRows, table, { mergeStops: board.mergeStops, mergeDeltaE: board.mergeDeltaE }, false);
    return {
      tones,
      swatches: swatchRows.map((s) => ({ id: s.id, name: s.name, hex: s.hex, estimated: swatchSpectrum(s, table).estimated })),
    };
  }
}
