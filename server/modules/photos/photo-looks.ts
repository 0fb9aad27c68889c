/**
 * Looks for photos: a saved look or a definition → the spectra and settings shared/photo composes
 * (PhotoLookSpectra), using the looks feature's resolver (production curves, library items, inline
 * sources, the key swatch); and the same as JSON for the browser's live preview.
 */
import crypto from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { Look } from '../../db/entities/look.entity';
import { NotFoundError } from '../../errors';
import { photoLookFingerprint, type PhotoLookSpectra } from '../../../shared/photo/compose-look';
import { GRID_NM_LIST } from '../../../shared/spectral/grid';
import { libraryFilter, libraryLight } from '../../../shared/spectral/library';
import { BLACKBODY_K, DAYLIGHT_CCT_K } from '../../../shared/spectral/limits';
import type { LookDefinition } from '../../../shared/schemas/look';
import type { PhotoFilterEdit, PhotoLightEdit, PhotoLookView } from '../../../shared/schemas/photo';
import type { FilterSource, LightSource } from '../../../shared/schemas/simulate';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { lookDefinition, prepareToneLooks } from '../boards/tone.service';
import { toneMediumId } from '../boards/board-tones';
import type { ResolvedLook } from '../looks/look-resolve';

export interface PhotoLookResolved {
  spectra: PhotoLookSpectra;
  resolved: ResolvedLook;
  definition: LookDefinition;
  name: string;
  /** sha-256 of the look's content (photoLookFingerprint), hex */
  contentHash: string;
}

/** Resolves a saved look (by id, in this production) or a definition. */
export async function resolvePhotoLook(em: EntityManager, productionId: number, choice: { lookId?: number; look?: LookDefinition }, table: UpsampleTable): Promise<PhotoLookResolved> {
  let def: LookDefinition & { id: number; name: string };
  if (choice.lookId !== undefined) {
    const l = await em.findOne(Look, { where: { id: choice.lookId, production: { id: productionId } } });
    if (!l) throw new NotFoundError('Look');
    def = lookDefinition(l);
  } else {
    def = { ...choice.look!, id: 0, name: 'Unsaved look' };
  }
  const [tl] = await prepareToneLooks(em, productionId, [def], table);
  const r = tl.resolved;
  const spectra: PhotoLookSpectra = {
    bareLight: r.bareLight.spectrum,
    filters: r.filters.map((f) => ({ spectrum: f.spectrum, on: f.on })),
    medium: r.medium.spectrum,
    mediumToneId: toneMediumId(r),
    tone: tl.tone,
    key: tl.key ?? null,
  };
  const contentHash = crypto.createHash('sha256').update(photoLookFingerprint(spectra)).digest('hex');
  return { spectra, resolved: r, definition: def, name: def.name, contentHash };
}

/** The inline or built-in light source a light reference stands for, if any. */
function lightSourceOf(def: LookDefinition): LightSource | null {
  const s = def.light.source;
  if (!s) return null;
  if (s.id) {
    const item = libraryLight(s.id);
    return item ? { ...item.definition, gels: [...(item.definition.gels ?? []), ...(s.gels ?? [])] } : null;
  }
  return s;
}

/** How the preview may retune the light: blackbodies and daylights by their CCT (CIE D65 counts as daylight 6504 K). */
export function lightEdit(def: LookDefinition): PhotoLightEdit | null {
  const s = lightSourceOf(def);
  if (!s) return null;
  const gels = s.gels ?? [];
  if (s.blackbody !== undefined) return { kind: 'blackbody', kelvin: s.blackbody, minKelvin: Math.max(BLACKBODY_K.min, 1500), maxKelvin: Math.min(BLACKBODY_K.max, 12000), gels };
  const daylightK = s.daylight ?? (s.cie === 'D65' ? 6504 : s.cie === 'D50' ? 5003 : undefined);
  if (daylightK !== undefined) return { kind: 'daylight', kelvin: daylightK, minKelvin: DAYLIGHT_CCT_K.min, maxKelvin: Math.min(DAYLIGHT_CCT_K.max, 12000), gels };
  return null;
}

/** How the preview may move a parametric filter (long-pass cut-on, short-pass cut-off, band centre). */
export function filterEdit(source: FilterSource | undefined): PhotoFilterEdit | null {
  if (!source) return null;
  const s = source.id ? libraryFilter(source.id)?.definition : source;
  if (!s) return null;
  if (s.longPass) return { source: s, form: 'longPass', param: 'cutOnNm', nm: s.longPass.cutOnNm };
  if (s.shortPass) return { source: s, form: 'shortPass', param: 'cutOffNm', nm: s.shortPass.cutOffNm };
  if (s.bandPass) return { source: s, form: 'bandPass', param: 'centreNm', nm: s.bandPass.centreNm };
  if (s.notch) return { source: s, form: 'notch', param: 'centreNm', nm: s.notch.centreNm };
  return null;
}

/** The browser's form of a resolved look (spectra as plain arrays). */
export function photoLookView(p: PhotoLookResolved): PhotoLookView {
  const arr = (v: Float64Array) => Array.from(v, (x) => Number(x.toPrecision(9)));
  const r = p.resolved;
  return {
    contentHash: p.contentHash,
    nm: [...GRID_NM_LIST],
    light: { label: r.bareLight.label, values: arr(r.bareLight.spectrum.values), edit: lightEdit(p.definition) },
    filters: r.filters.map((f, i) => ({ label: f.label, on: f.on, values: arr(f.spectrum.values), edit: filterEdit(p.definition.filters[i]?.filter.source) })),
    medium: { label: r.medium.label, values: arr(r.medium.spectrum.values) },
    mediumToneId: p.spectra.mediumToneId,
    tone: p.spectra.tone as PhotoLookView['tone'],
    key: p.spectra.key ? arr(p.spectra.key.values) : null,
  };
}
