/**
 * Looks for photos: a saved look or a definition → the spectra and settings shared/photo composes
 * (LookSpectra), using the looks feature's resolver (production curves, library items, inline
 * sources, the key swatch); and the same as JSON for the browser's live preview.
 */
import { InvalidError } from '../../errors';
import { findInProduction } from '../../db/in-production';
import crypto from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { Look } from '../../db/entities/look.entity';
import { lookFingerprint, type ComposedLook, type LookSpectra } from '../../../shared/look/compose-look';
import { GRID_NM_LIST } from '../../../shared/spectral/grid';
import { libraryFilter, libraryLight } from '../../../shared/spectral/library';
import { BLACKBODY_K, DAYLIGHT_CCT_K } from '../../../shared/spectral/limits';
import type { LookDefinition } from '../../../shared/schemas/look';
import type { PhotoFilterEdit, PhotoLightEdit, PhotoLookView } from '../../../shared/schemas/photo';
import type { FilterSource, LightSource } from '../../../shared/schemas/simulate';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { lookDefinition, prepareToneLooks } from '../tones/tone.service';
import type { ResolvedLook } from '../tones/look-resolve';

export interface PhotoLookResolved {
  spectra: LookSpectra;
  composed: ComposedLook;
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
    const l = await findInProduction(em, Look, productionId, choice.lookId, 'Look');
    def = lookDefinition(l);
  } else {
    def = { ...choice.look!, id: 0, name: 'Unsaved look' };
  }
  let tl: Awaited<ReturnType<typeof prepareToneLooks>>[number];
  try {
    [tl] = await prepareToneLooks(em, productionId, [def], table);
  } catch (e) {
    // an unsaved look's fields sit under `look` in the request
    if (e instanceof InvalidError && choice.lookId === undefined && e.field) throw new InvalidError(e.message.replace(e.field, `look.${e.field}`), `look.${e.field}`);
    throw e;
  }
  const spectra = tl.composed.spectra;
  const contentHash = crypto.createHash('sha256').update(lookFingerprint(spectra)).digest('hex');
  return { spectra, composed: tl.composed, resolved: tl.resolved, definition: def, name: def.name, contentHash };
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
