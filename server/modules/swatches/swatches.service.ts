import { Look } from '../../db/entities/look.entity';
import { Board } from '../../db/entities/board.entity';
import { InvalidError } from '../../errors';
import { previewOf, resolveImport, uploadText, type ImportUpload } from './swatch-import';
import { authoredView } from '../authored';
import { findInProduction } from '../../db/in-production';
import { IsNull, Not, type DataSource, type EntityManager } from 'typeorm';
import { Swatch } from '../../db/entities/swatch.entity';
import { Photo } from '../../db/entities/photo.entity';
import type { Membership } from '../../db/entities/membership.entity';
import type { Department } from '../../../shared/schemas/roles';
import { MAX_BOARD_SWATCHES } from '../../../shared/schemas/board';
import { swatchCreateSchema, swatchImportFieldsSchema, swatchUpdateSchema, type SwatchImportPreview, type SwatchOrigin, type SwatchView } from '../../../shared/schemas/swatch';
import type { z } from 'zod';
import { readTable } from '../library/table-input';
import { measuredFromTable } from './measured-swatch';
import { assertDepartmentAccess } from '../../policy/department-access';
import { hexOfColour } from './swatch-colour';
import { estimatedPairs, isModelled } from '../tones/swatch-spectra';
import { modelledFromSource } from './modelled-swatch';
import { getUpsampleTable } from '../../services/upsample-table';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';

type CreateInput = z.infer<typeof swatchCreateSchema>;
type UpdateInput = z.infer<typeof swatchUpdateSchema>;
type OriginInput = CreateInput['origin'];
type ImportFields = z.infer<typeof swatchImportFieldsSchema>;

/**
 * Turns an origin as given into what a swatch stores: origin, display hex, and the measured or modelled
 * reflectance (null when the spectrum is estimated from the colour). Skin and makeup are resolved by the
 * engine's model; a makeup whose paint is a colour value needs the upsampling table (`table`).
 */
export function resolveSwatchOrigin(o: OriginInput, field = 'origin', table: UpsampleTable | null = null): { origin: SwatchOrigin; hex: string; reflectance: [number, number][] | null } {
  if (o.type === 'skin') return { origin: { type: 'skin', skin: o.skin }, ...modelledFromSource({ skin: o.skin }, table, field) };
  if (o.type === 'makeup') return { origin: { type: 'makeup', makeup: o.makeup }, ...modelledFromSource({ makeup: o.makeup }, table, field) };
  if (o.type === 'colour') return { origin: { type: 'colour', colour: o.colour }, hex: hexOfColour(o.colour, `${field}.colour`), reflectance: null };
  if (o.type === 'photo') return { origin: { type: 'photo', photoId: o.photoId, rect: o.rect, colour: o.colour }, hex: hexOfColour(o.colour, `${field}.colour`), reflectance: null };
  return measuredFromTable(readTable(o.table, `${field}.table`), o.basis, `${field}.table`);
}

/**
 * A photo origin must name a photo of the swatch's production and a region inside its pixels (the
 * oriented width × height the photo's view gives): 400 naming `origin.photoId` or `origin.rect` otherwise.
 * A photo of another production is answered as one that does not exist (its existence is not revealed).
 */
export async function assertPhotoOrigin(em: EntityManager, productionId: number, o: OriginInput, field = 'origin'): Promise<void> {
  if (o.type !== 'photo') return;
  const photo = await em.findOne(Photo, { where: { id: o.photoId, production: { id: productionId } }, select: { id: true, width: true, height: true } });
  if (!photo) throw new InvalidError(`${field}.photoId: there is no photo ${o.photoId} in this production.`, `${field}.photoId`);
  const [x, y, w, h] = o.rect;
  if (x + w > photo.width || y + h > photo.height) {
    throw new InvalidError(
      `${field}.rect: the region (${w} × ${h} px at ${x}, ${y}) reaches outside the photo, which is ${photo.width} × ${photo.height} px; it must lie inside it.`,
      `${field}.rect`,
    );
  }
}

/** A swatch for the API; with `table`, its reflectance (measured, or the estimate) is included. */
export function swatchView(s: Swatch, table?: UpsampleTable, hasReflectance = s.reflectance != null): SwatchView {
  const v: SwatchView = {
    id: s.id,
    name: s.name,
    department: s.department,
    notes: s.notes,
    origin: s.origin,
    hex: s.hex,
    spectrum: isModelled(s.origin) ? 'modelled' : hasReflectance ? 'measured' : 'estimated',
    lightStops: s.lightStops ?? 0,
    ...authoredView(s),
  };
  if (table) v.reflectance = s.reflectance ?? estimatedPairs(s.hex, table);
  return v;
}

/** The name of a copy: "<name> (copy)", the name shortened to keep within 120 characters. */
export function copyName(name: string): string {
  const suffix = ' (copy)';
  return `${name.slice(0, 120 - suffix.length).trimEnd()}${suffix}`;
}

/** The columns a swatch's view needs when its spectrum is not asked for. */
const LIST_COLUMNS = {
  id: true, name: true, department: true, notes: true, origin: true, hex: true, lightStops: true, createdAt: true, updatedAt: true,
  createdBy: { id: true, name: true },
} as const;

export class SwatchesService {
  constructor(private ds: DataSource, private dataDir: string) {}

  private table() {
    return getUpsampleTable(this.dataDir);
  }

  /**
   * The production's swatches (of one department). Without `spectra` the reflectances are not read at all
   * (a measured one is some 400 numbers; 2,000 of them took most of the list's time), only whether each
   * swatch has one.
   */
  async list(productionId: number, opts: { department?: Department; spectra?: boolean } = {}) {
    const repo = this.ds.getRepository(Swatch);
    const where = { production: { id: productionId }, ...(opts.department ? { department: opts.department } : {}) };
    const order = { department: 'ASC', name: 'ASC', id: 'ASC' } as const;
    if (opts.spectra) {
      const table = await this.table();
      return (await repo.find({ where, relations: { createdBy: true }, order })).map((s) => swatchView(s, table));
    }
    const rows = await repo.find({ where, relations: { createdBy: true }, order, select: LIST_COLUMNS });
    const measured = new Set((await repo.find({ where: { ...where, reflectance: Not(IsNull()) }, select: { id: true } })).map((s) => s.id));
    return rows.map((s) => swatchView(s, undefined, measured.has(s.id)));
  }

  async entity(productionId: number, id: number, em: EntityManager = this.ds.manager): Promise<Swatch> {
    const s = await findInProduction(em, Swatch, productionId, id, 'Swatch', { createdBy: true });
    return s;
  }

  async get(productionId: number, id: number) {
    return swatchView(await this.entity(productionId, id), await this.table());
  }

  async create(m: Membership, input: CreateInput, em: EntityManager = this.ds.manager) {
    const department = input.department ?? m.department;
    assertDepartmentAccess(m, department, 'swatches');
    const table = await this.table();
    await assertPhotoOrigin(em, m.production.id, input.origin);
    const resolved = resolveSwatchOrigin(input.origin, 'origin', table);
    const s = await em.save(Swatch, em.create(Swatch, { production: m.production, department, name: input.name, notes: input.notes, lightStops: input.lightStops, ...resolved, createdBy: m.user }));
    return swatchView(s, table);
  }

  /**
   * A copy of a swatch in the same department, named "<name> (copy)": its origin, colour, reflectance,
   * notes and light kept. The department rule applies as for any change to the department's swatches (403).
   */
  async duplicate(m: Membership, id: number) {
    const table = await this.table();
    return this.ds.transaction(async (t) => {
      const s = await this.entity(m.production.id, id, t);
      assertDepartmentAccess(m, s.department, 'swatches');
      const copy = t.create(Swatch, {
        production: m.production,
        department: s.department,
        name: copyName(s.name),
        notes: s.notes,
        origin: s.origin,
        hex: s.hex,
        reflectance: s.reflectance,
        lightStops: s.lightStops ?? 0,
        createdBy: m.user,
      });
      return swatchView(await t.save(Swatch, copy), table);
    });
  }

  /**
   * Where imported swatches go: the department (given, else the board's, else the importer's) and the board,
   * which must be the production's; the department rule applies to both (403). Nothing is written.
   */
  private async importTarget(m: Membership, fields: ImportFields, em: EntityManager): Promise<{ board: Board | null; department: Department }> {
    let board: Board | null = null;
    if (fields.boardId !== undefined) {
      board = await em.findOne(Board, { where: { id: fields.boardId, production: { id: m.production.id } } });
      if (!board) throw new InvalidError(`boardId: board ${fields.boardId} is not in this production`, 'boardId');
      assertDepartmentAccess(m, board.department, 'boards');
    }
    const department = fields.department ?? board?.department ?? m.department;
    assertDepartmentAccess(m, department, 'swatches');
    return { board, department };
  }

  /** Reads a spectrophotometer file and answers what an import would add; writes nothing. */
  async importPreview(m: Membership, upload: ImportUpload, fields: ImportFields): Promise<SwatchImportPreview> {
    const { text, fileName } = uploadText(upload);
    await this.importTarget(m, fields, this.ds.manager);
    const { file, samples } = resolveImport(text, fileName);
    return previewOf(file, samples);
  }

  /**
   * One measured swatch per sample of a spectrophotometer file, put on the board if one is named; all or
   * nothing (every sample is resolved first, and the writes share one transaction).
   */
  async importFile(m: Membership, upload: ImportUpload, fields: ImportFields): Promise<SwatchView[]> {
    const { text, fileName } = uploadText(upload);
    const saved = await this.ds.transaction(async (t) => {
      const { board, department } = await this.importTarget(m, fields, t);
      const { samples } = resolveImport(text, fileName);
      if (board) assertBoardRoom(board, samples.length);
      const rows: Swatch[] = [];
      for (const r of samples) {
        rows.push(await t.save(Swatch, t.create(Swatch, { production: m.production, department, name: r.name, notes: r.notes, origin: r.origin, hex: r.hex, reflectance: r.reflectance, createdBy: m.user })));
      }
      // onto the board through its join table (the board's other swatches are not loaded)
      if (board) await t.createQueryBuilder().relation(Board, 'swatches').of(board).add(rows);
      return rows;
    });
    const table = await this.table();
    return saved.map((s) => swatchView(s, table));
  }

  /**
   * Edits name, notes, department, light and origin: a new colour is re-estimated, new skin or makeup
   * parameters recompute the reflectance and hex.
   */
  async update(m: Membership, id: number, input: UpdateInput) {
    const table = await this.table();
    return this.ds.transaction(async (t) => {
      const s = await this.entity(m.production.id, id, t);
      assertDepartmentAccess(m, s.department, 'swatches');
      if (input.department && input.department !== s.department) assertDepartmentAccess(m, input.department, 'swatches');
      if (input.origin) {
        // the same photo region sent back with an edit is kept as it was, even if its photo has gone since
        const o = input.origin;
        const unchanged = o.type === 'photo' && s.origin.type === 'photo' && s.origin.photoId === o.photoId && s.origin.rect.join() === o.rect.join();
        if (!unchanged) await assertPhotoOrigin(t, m.production.id, o);
        Object.assign(s, resolveSwatchOrigin(input.origin, 'origin', table));
      }
      if (input.name !== undefined) s.name = input.name;
      if (input.notes !== undefined) s.notes = input.notes;
      if (input.department) s.department = input.department;
      if (input.lightStops !== undefined) s.lightStops = input.lightStops;
      return swatchView(await t.save(s), table);
    });
  }

  async remove(m: Membership, id: number) {
    await this.ds.transaction(async (t) => {
      const s = await this.entity(m.production.id, id, t);
      assertDepartmentAccess(m, s.department, 'swatches');
      // a look keyed on this swatch falls back to middle grey, so it stays valid and editable
      const looks = await t.find(Look, { where: { production: { id: m.production.id } } });
      for (const l of looks) {
        const tone = (l.tone ?? {}) as { keySwatchId?: number | null };
        if (tone.keySwatchId === id) {
          l.tone = { ...l.tone, keySwatchId: null } as typeof l.tone;
          await t.save(l);
        }
      }
      await t.remove(s);
    });
  }
}

/** An import onto a board may not take it past the boards' limit (the same one a board's own edit keeps). */
function assertBoardRoom(board: Board, adding: number): void {
  const room = MAX_BOARD_SWATCHES - board.swatchIds.length;
  if (adding > room) {
    throw new InvalidError(`boardId: the board holds ${board.swatchIds.length} swatches and a board takes at most ${MAX_BOARD_SWATCHES}; this file adds ${adding} (room for ${Math.max(0, room)})`, 'boardId');
  }
}
