/**
 * A look's references → the engine's spectra. Production curves (`curveId`) are read from the
 * production's library (their grid samples, already in the engine's basis); built-in and inline
 * sources go through the engine's resolvers. Filters "on the light" are gels: they change the light
 * the scene is lit by (so the eye sees them too); filters "on the lens" only the camera sees.
 */
import { In, type EntityManager } from 'typeorm';
import { Curve } from '../../db/entities/curve.entity';
import { InvalidError } from '../../errors';
import { resolveFilter, resolveLight, resolveMedium, type LightPath, type FilterFactor } from '../../../shared/spectral/compute';
import { lookLightPath, type LookSpectra } from '../../../shared/look/compose-look';
import { TONE_MEDIUM_IDS } from '../../../shared/tone/media-tone';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { spectrumFromStoredPairs, type Spectrum } from '../../../shared/spectral/spectrum';
import { libraryFilter, libraryLight, libraryMedium } from '../../../shared/spectral/library';
import type { FilterRef, LightRef, MediumRef, CurveKind } from '../../../shared/schemas/curve';
import type { FilterPlace, LookDefinition } from '../../../shared/schemas/look';
import type { FilterSource, LightSource, MediumSource } from '../../../shared/schemas/simulate';

export interface ResolvedCurve {
  spectrum: Spectrum;
  /** a short name for the card ("Tungsten 3200 K", "Blackbody 2900 K", a curve's name) */
  label: string;
  /** where it came from */
  source: string;
  /** the built-in library id when it is one (for tone defaults), else null */
  libraryId: string | null;
  /** the production curve id when it is one */
  curveId: number | null;
}

export interface ResolvedLook {
  /** the lamp as chosen, before any gel */
  bareLight: ResolvedCurve;
  /** the light the scene is lit by: the lamp through the light-mounted filters, peak 1 */
  light: Spectrum;
  filters: (ResolvedCurve & { on: FilterPlace })[];
  medium: ResolvedCurve;
  /** the tone-defaults id of the medium (shared/tone/media-tone.ts) */
  mediumToneId: string;
  /** the light path for the swatches: gelled light, lens filters, medium (built once, shared/look/compose-look.ts) */
  path: LightPath;
  /** filter factor of every filter (gels and lens) against the bare lamp, on the medium */
  factor: FilterFactor;
}

/** The references of a look that may name production curves. */
export function refsOfLook(d: Pick<LookDefinition, 'light' | 'filters' | 'medium'>): { curveId?: number }[] {
  return [d.light, d.medium, ...d.filters.map((f) => f.filter)];
}

/** The production curves some references name, loaded once (id → curve of the production). */
export async function loadCurves(em: EntityManager, productionId: number, refs: { curveId?: number }[]): Promise<Map<number, Curve>> {
  const ids = new Set(refs.map((r) => r.curveId).filter((x): x is number => x !== undefined));
  if (!ids.size) return new Map();
  const rows = await em.find(Curve, { where: { id: In([...ids]), production: { id: productionId } } });
  return new Map(rows.map((c) => [c.id, c]));
}

function curveSpectrum(curves: Map<number, Curve>, id: number, kind: CurveKind, field: string): ResolvedCurve {
  const c = curves.get(id);
  if (!c) throw new InvalidError(`${field}.curveId: there is no curve ${id} in this production's library`, `${field}.curveId`);
  if (c.kind !== kind) throw new InvalidError(`${field}.curveId: "${c.name}" is a ${c.kind}, not a ${kind}`, `${field}.curveId`);
  return { spectrum: spectrumFromStoredPairs(c.samples, kind === 'medium' ? 'zero' : 'hold'), label: c.name, source: `production library: ${c.source}`, libraryId: null, curveId: c.id };
}

/** Runs an engine resolver; its refusal becomes a 400 on `field`.source…. */
function engine<T>(field: string, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof SpectralInputError) {
      const f = [field, 'source', ...e.path].join('.');
      throw new InvalidError(`${f}: ${e.reason}`, f);
    }
    throw e;
  }
}

function kelvin(k: number) {
  return `${Math.round(k)} K`;
}

/** A readable name for an inline light source. */
export function lightLabel(s: LightSource): string {
  const base = s.id ? (libraryLight(s.id)?.name ?? s.id)
    : s.cie ? `CIE illuminant ${s.cie}`
    : s.daylight ? `Daylight ${kelvin(s.daylight)}`
    : s.blackbody ? `Blackbody ${kelvin(s.blackbody)}`
    : s.led ? `White LED model (${s.led.emitterNm} nm emitter)`
    : 'Measured light';
  return s.gels?.length ? `${base} through ${s.gels.length} gel${s.gels.length > 1 ? 's' : ''}` : base;
}

/** A readable name for an inline filter source. */
export function filterLabel(s: FilterSource): string {
  if (s.id) return libraryFilter(s.id)?.name ?? s.id;
  if (s.longPass) return `Long-pass ${s.longPass.cutOnNm} nm`;
  if (s.shortPass) return `Short-pass ${s.shortPass.cutOffNm} nm`;
  if (s.bandPass) return `Band-pass ${s.bandPass.centreNm} nm, ${s.bandPass.widthNm} nm wide`;
  if (s.notch) return `Notch ${s.notch.centreNm} nm, ${s.notch.widthNm} nm wide`;
  if (s.neutralDensity !== undefined) return `Neutral density ${s.neutralDensity}`;
  return 'Measured filter';
}

/** A readable name for an inline medium source. */
export function mediumLabel(s: MediumSource): string {
  return s.id ? (libraryMedium(s.id)?.name ?? s.id) : 'Measured medium';
}

function sourceNote(kind: 'light' | 'filter' | 'medium', s: { id?: string }): string {
  if (s.id) {
    const item = kind === 'light' ? libraryLight(s.id) : kind === 'filter' ? libraryFilter(s.id) : libraryMedium(s.id);
    return item ? `built-in: ${item.note}` : 'built-in';
  }
  return 'given inline in the look';
}

export function resolveLightRef(r: LightRef, curves: Map<number, Curve>, field: string): ResolvedCurve {
  if (r.curveId !== undefined) return curveSpectrum(curves, r.curveId, 'light', field);
  const s = r.source!;
  return { spectrum: engine(field, () => resolveLight(s)), label: lightLabel(s), source: sourceNote('light', s), libraryId: s.id ?? null, curveId: null };
}
export function resolveFilterRef(r: FilterRef, curves: Map<number, Curve>, field: string): ResolvedCurve {
  if (r.curveId !== undefined) return curveSpectrum(curves, r.curveId, 'filter', field);
  const s = r.source!;
  return { spectrum: engine(field, () => resolveFilter(s)), label: filterLabel(s), source: sourceNote('filter', s), libraryId: s.id ?? null, curveId: null };
}
export function resolveMediumRef(r: MediumRef, curves: Map<number, Curve>, field: string): ResolvedCurve {
  if (r.curveId !== undefined) return curveSpectrum(curves, r.curveId, 'medium', field);
  const s = r.source!;
  return { spectrum: engine(field, () => resolveMedium(s)), label: mediumLabel(s), source: sourceNote('medium', s), libraryId: s.id ?? null, curveId: null };
}

/** The tone-defaults id of a medium: built-in media by their id, production curves as `curve.<id>`. */
export function toneMediumId(medium: Pick<ResolvedCurve, 'libraryId' | 'curveId'>): string {
  const id = medium.libraryId;
  if (id === null) return medium.curveId !== null ? `curve.${medium.curveId}` : 'custom';
  if (TONE_MEDIUM_IDS.includes(id)) return id;
  if (TONE_MEDIUM_IDS.includes(`medium.${id}`)) return `medium.${id}`;
  return id;
}

/** A look definition → spectra and its light path (built once). Throws InvalidError naming the field. */
export function resolveLook(def: LookDefinition, curves: Map<number, Curve>): ResolvedLook {
  const bareLight = resolveLightRef(def.light, curves, 'light');
  const filters = def.filters.map((f, i) => ({ ...resolveFilterRef(f.filter, curves, `filters.${i}.filter`), on: f.on }));
  const medium = resolveMediumRef(def.medium, curves, 'medium');
  const { light, path, factor } = engine('medium', () => lookLightPath({ bareLight: bareLight.spectrum, filters: filters.map((f) => ({ spectrum: f.spectrum, on: f.on })), medium: medium.spectrum }));
  return { bareLight, light, filters, medium, mediumToneId: toneMediumId(medium), path, factor };
}

/** The spectra the shared composition takes, from a resolved look, its tone settings and key. */
export function lookSpectra(r: ResolvedLook, tone: LookSpectra['tone'], key: Spectrum | null): LookSpectra {
  return {
    bareLight: r.bareLight.spectrum,
    filters: r.filters.map((f) => ({ spectrum: f.spectrum, on: f.on })),
    medium: r.medium.spectrum,
    mediumToneId: r.mediumToneId,
    tone,
    key,
  };
}
