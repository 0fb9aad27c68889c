import { In, type DataSource, type EntityManager } from 'typeorm';
import { authoredView } from '../authored';
import { findInProduction } from '../../db/in-production';
import { Board } from '../../db/entities/board.entity';
import { Look } from '../../db/entities/look.entity';
import { Swatch } from '../../db/entities/swatch.entity';
import type { Membership } from '../../db/entities/membership.entity';
import { InvalidError } from '../../errors';
import type { BoardView } from '../../../shared/schemas/board';
import { boardCreateSchema, boardUpdateSchema } from '../../../shared/schemas/board';
import type { z } from 'zod';
import { assertDepartmentAccess } from '../../policy/department-access';

type CreateInput = z.infer<typeof boardCreateSchema>;
type UpdateInput = z.infer<typeof boardUpdateSchema>;

export function boardView(b: Board): BoardView {
  return {
    id: b.id,
    name: b.name,
    department: b.department,
    notes: b.notes,
    lookIds: b.lookIds,
    swatchIds: [...(b.swatches ? b.swatches.map((s) => s.id) : (b.swatchIds ?? []))].sort((x, y) => x - y),
    mergeStops: b.mergeStops,
    mergeDeltaE: b.mergeDeltaE,
    ...authoredView(b),
  };
}

/** Checks that every id names a look of the production (400 naming the first stranger). */
async function checkLooks(em: EntityManager, productionId: number, ids: number[]) {
  if (!ids.length) return;
  const found = await em.find(Look, { where: { id: In(ids), production: { id: productionId } }, select: { id: true } });
  const have = new Set(found.map((l) => l.id));
  const i = ids.findIndex((id) => !have.has(id));
  if (i >= 0) throw new InvalidError(`lookIds.${i}: look ${ids[i]} is not in this production`, `lookIds.${i}`);
}

/** The swatches named, as ids only (all the join table needs), checked to be the production's. */
async function loadSwatches(em: EntityManager, productionId: number, ids: number[]): Promise<Swatch[]> {
  if (!ids.length) return [];
  const found = await em.find(Swatch, { where: { id: In(ids), production: { id: productionId } }, select: { id: true } });
  const have = new Set(found.map((s) => s.id));
  const i = ids.findIndex((id) => !have.has(id));
  if (i >= 0) throw new InvalidError(`swatchIds.${i}: swatch ${ids[i]} is not in this production`, `swatchIds.${i}`);
  return found;
}

export class BoardsService {
  constructor(private ds: DataSource) {}

  async list(productionId: number) {
    const rows = await this.ds.getRepository(Board).find({
      where: { production: { id: productionId } },
      relations: { createdBy: true },
      order: { department: 'ASC', name: 'ASC', id: 'ASC' },
    });
    return rows.map(boardView);
  }

  /** A board of the production with its author and its swatches' ids (not the swatches themselves). */
  async entity(productionId: number, id: number, em: EntityManager = this.ds.manager): Promise<Board> {
    return findInProduction(em, Board, productionId, id, 'Board', { createdBy: true });
  }

  async get(productionId: number, id: number) {
    return boardView(await this.entity(productionId, id));
  }

  async create(m: Membership, input: CreateInput) {
    const department = input.department ?? m.department;
    assertDepartmentAccess(m, department, 'boards');
    return this.ds.transaction(async (t) => {
      await checkLooks(t, m.production.id, input.lookIds);
      const swatches = await loadSwatches(t, m.production.id, input.swatchIds);
      const b = await t.save(Board, t.create(Board, {
        production: m.production, department, name: input.name, notes: input.notes, lookIds: input.lookIds,
        mergeStops: input.mergeStops, mergeDeltaE: input.mergeDeltaE, swatches, createdBy: m.user,
      }));
      return boardView(b);
    });
  }

  async update(m: Membership, id: number, input: UpdateInput) {
    return this.ds.transaction(async (t) => {
      const b = await this.entity(m.production.id, id, t);
      assertDepartmentAccess(m, b.department, 'boards');
      if (input.department && input.department !== b.department) assertDepartmentAccess(m, input.department, 'boards');
      if (input.lookIds) {
        await checkLooks(t, m.production.id, input.lookIds);
        b.lookIds = input.lookIds;
      }
      if (input.swatchIds) b.swatches = await loadSwatches(t, m.production.id, input.swatchIds);
      for (const k of ['name', 'notes', 'department', 'mergeStops', 'mergeDeltaE'] as const) {
        if (input[k] !== undefined) (b as unknown as Record<string, unknown>)[k] = input[k];
      }
      return boardView(await t.save(b));
    });
  }

  async remove(m: Membership, id: number) {
    await this.ds.transaction(async (t) => {
      const b = await this.entity(m.production.id, id, t);
      assertDepartmentAccess(m, b.department, 'boards');
      await t.remove(b);
    });
  }
}

/** Drops a deleted look from every board of the production (inside the caller's transaction). */
export async function dropLookFromBoards(em: EntityManager, productionId: number, lookId: number): Promise<void> {
  const boards = await em.find(Board, { where: { production: { id: productionId } } });
  for (const b of boards) {
    if (!b.lookIds.includes(lookId)) continue;
    b.lookIds = b.lookIds.filter((x) => x !== lookId);
    await em.save(b);
  }
}
