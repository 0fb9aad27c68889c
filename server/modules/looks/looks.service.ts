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
import { In } from 'typeorm';
import { MAX_LIGHT_BUDGET_LOOKS, lightBudgetRequestSchema, type LightBudgetAnswer, type LightBudgetLook } from '../../../shared/schemas/look';
import { lightBudget } from '../../../shared/tone/light-budget';
import { shutterTimeSeconds } from '../../../shared/tone/light-level';
import { mediumToneDefaults } from '../../../shared/tone/media-tone';
import { getUpsampleTable } from '../../services/upsample-table';
import { resolvePhotoLook } from '../photos/photo-looks';
import { photoToneModel } from '../../../shared/photo/look-photo-model';
import { MONITOR_TABLE_TYPES, monitorTable, monitorTableFileName, writeClf, writeCube, type MonitorTableQuery } from '../../../shared/look/monitor-table';

type CreateInput = z.infer<typeof lookCreateSchema>;
type UpdateInput = z.infer<typeof lookUpdateSchema>;
type AnalyseInput = z.infer<typeof lookAnalyseSchema>;
type LightBudgetInput = z.infer<typeof lightBudgetRequestSchema>;

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
  private lutDataDir: string;
  constructor(private ds: DataSource, dataDir: string) {
    this.tones = new ToneService(ds, dataDir);
    this.lutDataDir = dataDir;
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

  /**
   * A saved look as a monitoring table (shared/look/monitor-table.ts): the look composed as boards and
   * photos compose it, its grey at every node of a size³ cube, written as a cube or CLF file.
   */
  async monitorTable(productionId: number, id: number, q: MonitorTableQuery): Promise<{ body: string; fileName: string; contentType: string }> {
    const table = await getUpsampleTable(this.lutDataDir);
    const look = await resolvePhotoLook(this.ds.manager, productionId, { lookId: id }, table);
    const greys = monitorTable(photoToneModel(look.composed, table), q.size);
    const meta = { lookName: look.name, id: `grisaille-look-${id}-${look.contentHash.slice(0, 12)}-${q.size}`, app: 'Grisaille' };
    return {
      body: q.format === 'clf' ? writeClf(greys, meta) : writeCube(greys, meta),
      fileName: monitorTableFileName(look.name, q.format, q.size),
      contentType: MONITOR_TABLE_TYPES[q.format],
    };
  }

  /**
   * The light budget between looks (POST …/looks/light-budget): each look's EI chain and light level worked
   * out as its exposure sheet does (analyseLook's filter factor for its own light and medium, the box speed of
   * its tone settings or its medium, exposurePlan), then the light each needs against the first look. The
   * camera is the request's, else the first look's tone settings. Looks not in the production are a 400 on
   * `lookIds`; so is a first look without an exposure index (the eye).
   */
  async lightBudget(productionId: number, input: LightBudgetInput): Promise<LightBudgetAnswer> {
    const rows = await this.ds.getRepository(Look).find({ where: { id: In(input.lookIds), production: { id: productionId } } });
    const byId = new Map(rows.map((l) => [l.id, l]));
    const missing = input.lookIds.filter((id) => !byId.has(id));
    if (missing.length) {
      throw new InvalidError(`lookIds: ${missing.length > 1 ? `looks ${missing.join(', ')} are` : `look ${missing[0]} is`} not in this production`, 'lookIds');
    }
    const looks = input.lookIds.map((id) => byId.get(id)!);
    const curves = await loadCurves(this.ds.manager, productionId, looks.flatMap(refsOfLook));
    const chains = looks.map((l) => {
      const tone = toneSettingsSchema.parse(l.tone ?? {});
      const resolved = resolveLook({ ...l, tone }, curves);
      const analysis = analyseLook(resolved, tone);
      const boxSpeed = tone.boxSpeed ?? mediumToneDefaults(resolved.mediumToneId).boxSpeed;
      return { tone, opaque: analysis.factor.opaque, chain: boxSpeed === null ? null : { boxSpeed, ratingStops: tone.ratingStops, filterStops: analysis.factor.stops } };
    });
    const first = { look: looks[0], ...chains[0] };
    if (!first.chain) throw new InvalidError(`lookIds: the first look, "${first.look.name}", is on the eye and has no exposure index; put a look on a film or sensor first`, 'lookIds');
    const defaulted = (['tStop', 'fps', 'shutterAngle'] as const).filter((k) => input[k] === undefined);
    const camera = {
      tStop: input.tStop ?? first.tone.tStop,
      fps: input.fps ?? first.tone.fps,
      shutterAngle: input.shutterAngle ?? first.tone.shutterAngle,
      calibrationConstant: first.tone.calibrationConstant,
    };
    const budget = lightBudget(chains.map((c) => c.chain), camera);
    const out: LightBudgetLook[] = looks.map((l, i) => {
      const b = budget[i];
      return {
        lookId: l.id, name: l.name,
        effectiveEI: b?.effectiveEI ?? null, exactEI: b?.exactEI ?? null, lux: b?.lux ?? null, footcandles: b?.footcandles ?? null,
        relative: b?.relative ?? null, stops: b?.stops ?? null, exactRelative: b?.exactRelative ?? null, opaque: chains[i].opaque,
      };
    });
    return {
      looks: out,
      camera: {
        ...camera,
        exposureSeconds: shutterTimeSeconds(camera.fps, camera.shutterAngle),
        defaultsFrom: { lookId: first.look.id, name: first.look.name },
        defaulted: [...defaulted, 'calibrationConstant'],
      },
    };
  }

  /**
   * The light budget an exposure sheet shows: every look of the production in id order (the first is the
   * reference), at the sheet look's own camera so its level matches its sheet. NotFoundError when the look
   * is not in the production.
   */
  async sheetLightBudget(productionId: number, lookId: number): Promise<LightBudgetAnswer> {
    const look = await this.entity(productionId, lookId);
    const tone = toneSettingsSchema.parse(look.tone ?? {});
    const ids = (await this.ds.getRepository(Look).find({ select: { id: true }, where: { production: { id: productionId } }, order: { id: 'ASC' } })).map((l) => l.id);
    // past the limit: the reference, this look and the next ones in id order
    const lookIds = ids.length <= MAX_LIGHT_BUDGET_LOOKS ? ids : [...new Set([ids[0], lookId, ...ids])].slice(0, MAX_LIGHT_BUDGET_LOOKS).sort((a, b) => a - b);
    return this.lightBudget(productionId, { lookIds, tStop: tone.tStop, fps: tone.fps, shutterAngle: tone.shutterAngle });
  }
}
