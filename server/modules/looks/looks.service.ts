import { zodToInvalid } from '../../middleware/validate';
import { authoredView } from '../authored';
import { findInProduction } from '../../db/in-production';
import type { DataSource } from 'typeorm';
import { Look } from '../../db/entities/look.entity';
import type { Membership } from '../../db/entities/membership.entity';
import { InvalidError } from '../../errors';
import { lookAnalyseSchema, lookCreateSchema, lookUpdateSchema, type LookAnalysis, type LookDefinition, type LookView } from '../../../shared/schemas/look';
import type { z } from 'zod';
import { loadCurves, refsOfLook, resolveLook } from '../tones/look-resolve';
import { analyseLook } from './look-analysis';
import { dropLookFromBoards } from '../boards/boards.service';
import { ToneService } from '../tones/tone.service';
import { Swatch } from '../../db/entities/swatch.entity';
import type { EntityManager } from 'typeorm';
import { toneSettingsSchema } from '../../../shared/schemas/exposure';

type CreateInput = z.infer<typeof lookCreateSchema>;
type UpdateInput = z.infer<typeof lookUpdateSchema>;
type AnalyseInput = z.infer<typeof lookAnalyseSchema>;

export function lookView(l: Look): LookView {
  return {
    id: l.id,
    name: l.name,
    notes: l.notes,
    light: l.light,
    filters: l.filters,
    medium: l.medium,
    tone: toneSettingsSchema.parse(l.tone ?? {}),
    ...authoredView(l),
  };
}

/** Checks that a definition resolves (curves exist and fit, the engine accepts every source, the key swatch exists). */
async function checkDefinition(em: EntityManager, productionId: number, def: LookDefinition) {
  const curves = await loadCurves(em, productionId, refsOfLook(def));
  resolveLook(def, curves);
  if (def.tone.keySwatchId != null && !(await em.findOne(Swatch, { where: { id: def.tone.keySwatchId, production: { id: productionId } } }))) {
    throw new InvalidError(`tone.keySwatchId: swatch ${def.tone.keySwatchId} is not in this production`, 'tone.keySwatchId');
  }
}

/** Looks: viewers read and analyse; editors and owners create, change, duplicate and delete. */
export class LooksService {
  private tones: ToneService;
  constructor(private ds: DataSource, dataDir: string) {
    this.tones = new ToneService(ds, dataDir);
  }

  async list(productionId: number) {
    const rows = await this.ds.getRepository(Look).find({ where: { production: { id: productionId } }, relations: { createdBy: true }, order: { id: 'ASC' } });
    return rows.map(lookView);
  }

  private async entity(productionId: number, id: number, em: EntityManager = this.ds.manager) {
    const l = await findInProduction(em, Look, productionId, id, 'Look', { createdBy: true });
    return l;
  }

  async get(productionId: number, id: number) {
    return lookView(await this.entity(productionId, id));
  }

  async create(m: Membership, input: CreateInput) {
    return this.ds.transaction(async (t) => {
      await checkDefinition(t, m.production.id, input);
      const l = await t.save(Look, t.create(Look, { production: m.production, name: input.name, notes: input.notes, light: input.light, filters: input.filters, medium: input.medium, tone: input.tone, createdBy: m.user }));
      return lookView(l);
    });
  }

  async update(m: Membership, id: number, input: UpdateInput) {
    return this.ds.transaction(async (t) => {
      const l = await this.entity(m.production.id, id, t);
      for (const k of ['name', 'notes', 'light', 'filters', 'medium'] as const) {
        if (input[k] !== undefined) (l as unknown as Record<string, unknown>)[k] = input[k];
      }
      if (input.tone !== undefined) {
        // only the tone fields sent change; the merged whole is checked again
        const merged = toneSettingsSchema.safeParse({ ...toneSettingsSchema.parse(l.tone ?? {}), ...input.tone });
        if (!merged.success) {
          const bad = zodToInvalid(merged.error);
          throw new InvalidError(`tone.${bad.message}`, bad.field ? `tone.${bad.field}` : 'tone');
        }
        l.tone = merged.data;
      }
      await checkDefinition(t, m.production.id, l);
      return lookView(await t.save(l));
    });
  }

  async duplicate(m: Membership, id: number, name?: string) {
    return this.ds.transaction(async (t) => {
      const l = await this.entity(m.production.id, id, t);
      const copy = await t.save(Look, t.create(Look, {
        production: m.production, name: (name ?? `${l.name} (copy)`).slice(0, 120), notes: l.notes,
        light: l.light, filters: l.filters, medium: l.medium, tone: l.tone, createdBy: m.user,
      }));
      return lookView(copy);
    });
  }

  async remove(m: Membership, id: number) {
    await this.ds.transaction(async (t) => {
      const l = await this.entity(m.production.id, id, t);
      await dropLookFromBoards(t, m.production.id, id);
      await t.remove(l);
    });
  }

  async analysis(productionId: number, id: number): Promise<LookAnalysis> {
    const t0 = performance.now();
    const l = await this.entity(productionId, id);
    const curves = await loadCurves(this.ds.manager, productionId, refsOfLook(l));
    return analyseLook(resolveLook(l, curves), toneSettingsSchema.parse(l.tone ?? {}), t0);
  }

  /** An unsaved look (the bench while it is edited), with a board's tones through it when asked. */
  async analyse(productionId: number, input: AnalyseInput) {
    const t0 = performance.now();
    const curves = await loadCurves(this.ds.manager, productionId, refsOfLook(input.look));
    const analysis = analyseLook(resolveLook(input.look, curves), input.look.tone, t0);
    const board = input.boardId ? await this.tones.unsavedLookTones(productionId, { ...input.look, id: 0, name: 'Bench' }, input.boardId) : null;
    return { analysis, board };
  }
}
