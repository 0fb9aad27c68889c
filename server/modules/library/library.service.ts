import type { DataSource } from 'typeorm';
import { authoredView } from '../authored';
import { findInProduction } from '../../db/in-production';
import { Curve } from '../../db/entities/curve.entity';
import { Look } from '../../db/entities/look.entity';
import type { Membership } from '../../db/entities/membership.entity';
import { ConflictError } from '../../errors';
import { curveCreateSchema, curveUpdateSchema, type CurveView } from '../../../shared/schemas/curve';
import type { z } from 'zod';
import { buildCurve } from './curve-build';
import { refsOfLook } from '../tones/look-resolve';

type CreateInput = z.infer<typeof curveCreateSchema>;
type UpdateInput = z.infer<typeof curveUpdateSchema>;

/** Ids of the production curves a look refers to. */
export function curveIdsOfLook(l: Pick<Look, 'light' | 'filters' | 'medium'>): number[] {
  return refsOfLook(l).map((r) => r.curveId).filter((x): x is number => x !== undefined);
}

function view(c: Curve, usedBy: number): CurveView {
  return {
    id: c.id,
    kind: c.kind,
    name: c.name,
    notes: c.notes,
    origin: c.origin,
    samples: c.samples,
    source: c.source,
    usedBy,
    ...authoredView(c),
  };
}

/** A production's own curves (its library). Editors and owners change it; everyone reads it. */
export class LibraryService {
  constructor(private ds: DataSource) {}

  private async usage(productionId: number): Promise<Map<number, Look[]>> {
    const looks = await this.ds.getRepository(Look).find({ where: { production: { id: productionId } } });
    const m = new Map<number, Look[]>();
    for (const l of looks) for (const id of new Set(curveIdsOfLook(l))) m.set(id, [...(m.get(id) ?? []), l]);
    return m;
  }

  async list(productionId: number) {
    const rows = await this.ds.getRepository(Curve).find({ where: { production: { id: productionId } }, relations: { createdBy: true }, order: { kind: 'ASC', name: 'ASC' } });
    const used = await this.usage(productionId);
    return rows.map((c) => view(c, used.get(c.id)?.length ?? 0));
  }

  private async entity(productionId: number, id: number) {
    const c = await findInProduction(this.ds.manager, Curve, productionId, id, 'Curve', { createdBy: true });
    return c;
  }

  async get(productionId: number, id: number) {
    const c = await this.entity(productionId, id);
    return view(c, (await this.usage(productionId)).get(id)?.length ?? 0);
  }

  /** Reads and converts the curve first; nothing is written when the file or form is refused. */
  async create(m: Membership, input: CreateInput) {
    return this.ds.transaction(async (t) => {
      const built = await buildCurve(t, m.production.id, input.kind, input.origin);
      const c = await t.save(Curve, t.create(Curve, { production: m.production, kind: input.kind, name: input.name, notes: input.notes, ...built, createdBy: m.user }));
      return view(c, 0);
    });
  }

  async update(m: Membership, id: number, input: UpdateInput) {
    const c = await this.entity(m.production.id, id);
    if (input.name !== undefined) c.name = input.name;
    if (input.notes !== undefined) c.notes = input.notes;
    await this.ds.getRepository(Curve).save(c);
    return this.get(m.production.id, id);
  }

  /** A curve used by a look cannot be deleted (the look would lose part of its light path). */
  async remove(m: Membership, id: number) {
    await this.ds.transaction(async (t) => {
      const c = await findInProduction(t, Curve, m.production.id, id, 'Curve');
      const looks = (await t.find(Look, { where: { production: { id: m.production.id } } })).filter((l) => curveIdsOfLook(l).includes(id));
      if (looks.length) throw new ConflictError(`"${c.name}" is used by ${looks.map((l) => `"${l.name}"`).join(', ')}; change those looks first.`);
      await t.remove(c);
    });
  }
}
