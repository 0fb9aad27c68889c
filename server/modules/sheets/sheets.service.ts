/**
 * The exposure sheet of a look: everything the camera crew and the gaffer take to set, worked out by the
 * engine (shared/spectral via the looks module) and the tone model (shared/tone). Composition only.
 */
import { LooksService } from '../looks/looks.service';
import { findInProduction } from '../../db/in-production';
import { In, type DataSource } from 'typeorm';
import { Look } from '../../db/entities/look.entity';
import { Board } from '../../db/entities/board.entity';
import { Swatch } from '../../db/entities/swatch.entity';
import { Production } from '../../db/entities/production.entity';
import { toneSettingsSchema, type EiChainStepAnswer, type ToneSettings } from '../../../shared/schemas/exposure';
import { NEAR_THRESHOLD_STOPS, SHEET_CAUTIONS, type ExposureSheet, type SheetFactor, type SheetFlag, type SheetSwatch } from '../../../shared/schemas/sheet';
import { InvalidError } from '../../errors';
import { eiChain, formatStops } from '../../../shared/tone/ei-chain';
import { COMMON_T_STOPS, exposurePlan, lightLevelTable } from '../../../shared/tone/exposure-plan';
import { DEFAULT_INCIDENT_C, DEFAULT_INCIDENT_C_NOTE } from '../../../shared/tone/light-level';
import type { TonePipeline } from '../../../shared/tone/tone-pipeline';
import { developmentGammaFactor } from '../../../shared/tone/development';
import { zoneNumeral } from '../../../shared/tone/zones';
import { getUpsampleTable } from '../../services/upsample-table';
import { analyseLook } from '../looks/look-analysis';
import { lookDefinition, prepareToneLooks, tonesInPool } from '../tones/tone.service';
import type { ToneLook } from '../tones/board-tones';

const STEP_LABELS: Record<EiChainStepAnswer['step'], string> = { box: 'Box speed', rating: 'Development / rating', filter: 'Filter factor' };

function halfOrThird(a: number): string {
  const halves = Math.round(a * 2);
  if (Math.abs(a * 2 - halves) < 1e-6 && halves % 2 === 1) return `${Math.floor(a) || ''}½`;
  return formatStops(a).replace('+', '');
}

function developmentWords(p: TonePipeline, t: ToneSettings): string {
  if (p.defaults.kind === 'eye') return 'none (the eye is the reference)';
  if (p.defaults.kind === 'sensor') return 'none (sensor)';
  const s = t.developmentStops;
  if (Math.abs(s) < 1e-9) return 'normal development';
  return `${s > 0 ? 'pushed' : 'pulled'} ${halfOrThird(Math.abs(s))} stop${Math.abs(s) > 1 ? 's' : ''} (gamma ×${developmentGammaFactor(s).toFixed(2)})`;
}

function printWords(p: TonePipeline, t: ToneSettings): string {
  const exp = Math.abs(t.printExposureStops) < 1e-9 ? 'timed for zone V' : `${formatStops(t.printExposureStops)} stop${Math.abs(t.printExposureStops) > 1 ? 's' : ''} ${t.printExposureStops > 0 ? 'darker' : 'lighter'}`;
  if (p.defaults.kind === 'eye') return 'shown as seen';
  if (p.defaults.kind === 'sensor') return `display, contrast grade ${t.printGrade}, ${exp}`;
  return `print, contrast grade ${t.printGrade}, ${exp}`;
}

/**
 * What to watch on a swatch, from its tone against the thresholds in force (stops from zone V, key placed):
 * lost/blown as the tone model flags them; "near" within NEAR_THRESHOLD_STOPS of a threshold or when the
 * plausible range of a colour-only swatch reaches over it.
 */
export function sheetFlag(t: { stops: number; lost: boolean; blown: boolean; range: { plausible: readonly [number, number] } }, shadowDetailStops: number, highlightRollOffStops: number): SheetFlag | null {
  if (t.lost) return 'lost';
  if (t.blown) return 'blown';
  if (t.stops < -shadowDetailStops + NEAR_THRESHOLD_STOPS || t.range.plausible[0] < -shadowDetailStops) return 'near-lost';
  if (t.stops > highlightRollOffStops - NEAR_THRESHOLD_STOPS || t.range.plausible[1] > highlightRollOffStops) return 'near-blown';
  return null;
}

export class SheetsService {
  constructor(private ds: DataSource, private dataDir: string) {}

  /**
   * The sheets of several looks, in the order given, for one PDF of the day; InvalidError naming `looks`
   * when any of them is not a look of this production.
   */
  async daySheets(productionId: number, lookIds: readonly number[]): Promise<ExposureSheet[]> {
    const found = await this.ds.manager.find(Look, { where: { production: { id: productionId }, id: In([...lookIds]) }, select: { id: true } });
    const missing = lookIds.filter((id) => !found.some((l) => l.id === id));
    if (missing.length) throw new InvalidError(`looks: ${missing.length > 1 ? `looks ${missing.join(', ')} are` : `look ${missing[0]} is`} not in this production.`, 'looks');
    const out: ExposureSheet[] = [];
    for (const id of lookIds) out.push(await this.sheet(productionId, id));
    return out;
  }

  /**
   * The sheet of look `lookId` of production `productionId`; NotFoundError when the look is not in it.
   * `boardIds` picks the boards whose swatches it lists (InvalidError naming `boards` when one is not in the
   * production); without it, every board that shows the look.
   */
  async sheet(productionId: number, lookId: number, boardIds?: readonly number[]): Promise<ExposureSheet> {
    const em = this.ds.manager;
    const look = await findInProduction(em, Look, productionId, lookId, 'Look');
    const production = await em.findOneByOrFail(Production, { id: productionId });
    const tone = toneSettingsSchema.parse(look.tone ?? {});
    const def = { ...lookDefinition(look), tone };

    const table = await getUpsampleTable(this.dataDir);
    const [toneLook] = await prepareToneLooks(em, productionId, [def], table);
    const { resolved, composed } = toneLook;
    const analysis = analyseLook(resolved, tone);
    const mediumId = resolved.mediumToneId;
    const pipeline = composed.pipeline;

    const factors: SheetFactor[] = [
      { label: 'This look’s light', ...analysis.factor },
      { label: 'Daylight', ...analysis.daylight },
      { label: 'Tungsten', ...analysis.tungsten },
    ];

    const camera = { tStop: tone.tStop, fps: tone.fps, shutterAngle: tone.shutterAngle, calibrationConstant: tone.calibrationConstant };
    const boxSpeed = tone.boxSpeed ?? pipeline.defaults.boxSpeed;
    let chain: ExposureSheet['chain'] = null;
    let lightLevels: ExposureSheet['lightLevels'] = [];
    let cost: ExposureSheet['cost'] = null;
    let exposureSeconds = camera.shutterAngle / (360 * camera.fps);
    if (boxSpeed !== null) {
      const plan = exposurePlan({ boxSpeed, ratingStops: tone.ratingStops, filterStops: analysis.factor.stops, ...camera });
      exposureSeconds = plan.light.exposureSeconds;
      chain = {
        boxSpeed,
        steps: plan.chain.steps.map((s) => ({ ...s, label: STEP_LABELS[s.step], stopsLabel: formatStops(s.stops) })),
        totalStops: plan.chain.totalStops,
        unfilteredEI: plan.chain.unfilteredEI,
        effectiveEI: plan.chain.effectiveEI,
        byLight: factors.slice(1).map((f) => ({
          label: f.label,
          light: f.light,
          filterStops: f.stops,
          effectiveEI: eiChain({ boxSpeed, ratingStops: tone.ratingStops, filterStops: f.stops }).effectiveEI,
        })),
      };
      const stops = [...new Set([...COMMON_T_STOPS, camera.tStop])].sort((a, b) => a - b);
      const open = lightLevelTable(plan.chain.unfilteredEI, camera, stops);
      lightLevels = lightLevelTable(plan.chain.effectiveEI, camera, stops).map((r, i) => ({ ...r, unfilteredFootcandles: open[i].footcandles }));
      cost = plan.cost;
    }

    const { swatches, boards, boardChoices } = await this.keySwatches(productionId, look, tone, toneLook, boardIds);
    const keySwatch = tone.keySwatchId !== null ? await em.findOne(Swatch, { where: { id: tone.keySwatchId, production: { id: productionId } } }) : null;
    return {
      production: { id: production.id, name: production.name },
      look: { id: look.id, name: look.name, notes: look.notes, updatedAt: new Date(look.updatedAt).toISOString() },
      lightPath: {
        light: resolved.bareLight.label,
        filters: resolved.filters.map((f) => ({ label: f.label, on: f.on })),
        medium: resolved.medium.label,
        toneKind: pipeline.defaults.kind,
        development: developmentWords(pipeline, tone),
        print: printWords(pipeline, tone),
      },
      toneMediumId: mediumId,
      tone,
      factors,
      chain,
      camera: {
        ...camera,
        exposureSeconds,
        calibrationNote: camera.calibrationConstant === DEFAULT_INCIDENT_C ? DEFAULT_INCIDENT_C_NOTE : `incident-light constant C = ${camera.calibrationConstant} lux·s as set for this look (E in lux)`,
      },
      lightLevels,
      cost,
      key: {
        description: keySwatch ? `${keySwatch.name} placed on zone ${zoneNumeral(tone.keyZone)}` : `middle grey (18 %) on zone ${zoneNumeral(tone.keyZone)}`,
        zone: tone.keyZone,
        numeral: zoneNumeral(tone.keyZone),
      },
      thresholds: { shadowDetailStops: pipeline.shadowDetailStops, highlightRollOffStops: pipeline.highlightRollOffStops },
      swatches,
      boards,
      boardChoices,
      boardsPicked: boardIds !== undefined,
      notes: look.notes,
      cautions: SHEET_CAUTIONS,
      // a budget that cannot be said (the first look is the eye, which has no EI) is left off; anything else is an error
      lightBudget: await new LooksService(this.ds, this.dataDir).sheetLightBudget(productionId, lookId).catch((e: unknown) => {
        if (e instanceof InvalidError) return null;
        throw e;
      }),
      generatedAt: new Date().toISOString(),
    };
  }

  /**
   * Every swatch of the boards on the sheet (those picked, else those that show this look) plus its key
   * swatch: key first, then lightest to darkest, the darkest flagged rather than left off.
   */
  private async keySwatches(productionId: number, look: Look, tone: ToneSettings, toneLook: ToneLook, boardIds?: readonly number[]): Promise<Pick<ExposureSheet, 'swatches' | 'boards' | 'boardChoices'>> {
    const em = this.ds.manager;
    const all = await em.find(Board, { where: { production: { id: productionId } }, relations: { swatches: true }, order: { department: 'ASC', name: 'ASC', id: 'ASC' } });
    if (boardIds) {
      const missing = boardIds.filter((id) => !all.some((b) => b.id === id));
      if (missing.length) throw new InvalidError(`boards: ${missing.length > 1 ? `boards ${missing.join(', ')} are` : `board ${missing[0]} is`} not in this production.`, 'boards');
    }
    const onSheet = (b: Board) => (boardIds ? boardIds.includes(b.id) : b.lookIds.includes(look.id));
    const using = all.filter(onSheet);
    const boardChoices = all.map((b) => ({ id: b.id, name: b.name, department: b.department, swatchCount: b.swatches.length, showsLook: b.lookIds.includes(look.id), onSheet: onSheet(b) }));
    const boards = using.map((b) => b.name);
    const rows = new Map<number, { swatch: Swatch; board: string }>();
    for (const b of using) for (const s of b.swatches) if (!rows.has(s.id)) rows.set(s.id, { swatch: s, board: b.name });
    if (tone.keySwatchId !== null && !rows.has(tone.keySwatchId)) {
      const k = await em.findOne(Swatch, { where: { id: tone.keySwatchId, production: { id: productionId } } });
      if (k) rows.set(k.id, { swatch: k, board: '(key)' });
    }
    if (!rows.size) return { swatches: [], boards, boardChoices };
    const table = await getUpsampleTable(this.dataDir);
    const list = [...rows.values()];
    const { shadowDetailStops, highlightRollOffStops } = toneLook.composed.pipeline;
    const [{ tones }] = await tonesInPool(this.ds, [toneLook], list.map((r) => r.swatch), table, { mergeStops: 0, mergeDeltaE: Infinity });
    const out: SheetSwatch[] = tones.map((t, i) => ({
      swatchId: t.swatchId,
      name: list[i].swatch.name,
      hex: list[i].swatch.hex,
      board: list[i].board,
      stops: t.stops,
      zone: t.zone,
      numeral: t.numeral,
      grey: t.grey,
      shift: t.shift,
      lost: t.lost,
      blown: t.blown,
      key: t.swatchId === tone.keySwatchId,
      flag: sheetFlag(t, shadowDetailStops, highlightRollOffStops),
      range: t.range,
    }));
    out.sort((a, b) => Number(b.key) - Number(a.key) || b.stops - a.stops);
    return { swatches: out, boards, boardChoices };
  }
}
