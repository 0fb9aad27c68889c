/// <reference lib="webworker" />
/**
 * The preview worker: builds a look's photo table in the browser with the shared engine and the
 * server's upsampling table (fetched once, binary), off the page's thread; and, where WebGL2 is
 * missing, applies it to the preview image (the CPU fallback).
 */
import { decodeUpsampleTable, type UpsampleTable } from '../../../../shared/spectral/upsample-table';
import { resolveFilter, resolveLight } from '../../../../shared/spectral/compute';
import { makeSpectrum } from '../../../../shared/spectral/spectrum';
import { nodeReflectances } from '../../../../shared/spectral/node-spectra';
import type { LookSpectra } from '../../../../shared/look/compose-look';
import { previewGpuTable, previewLook, previewStopsLut, type PreviewToneCache } from '../../../../shared/photo/preview-lut';
import { PREVIEW_LUT_SIZE } from '../../../../shared/photo/exposure-lut';
import { planLut8, applyLut8, type LutPlan8 } from '../../../../shared/photo/apply-lut';
import type { ToneCurveTable } from '../../../../shared/look/tone-curve-table';
import { api } from '../../../lib/api-client';
import type { ExposureLut } from '../../../../shared/photo/exposure-lut';
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import type { ToneSettings } from '../../../../shared/schemas/exposure';
import { editedFilterSource, editedLightSource, type LookEdits } from './look-edits';
import type { FromWorker, PreviewLut, ToWorker } from './preview-protocol';
import { apiPaths } from '../../../lib/paths';

declare const self: DedicatedWorkerGlobalScope;
const post = (m: FromWorker, transfer: Transferable[] = []) => self.postMessage(m, transfer);

let tables: Promise<{ upsample: UpsampleTable }> | null = null;
function loadTables() {
  tables ??= (async () => {
    const t0 = performance.now();
    const blob = await api.get<Blob>(apiPaths.upsampleTable(), { blob: true });
    const upsample = decodeUpsampleTable(new Uint8Array(await blob.arrayBuffer()));
    nodeReflectances(upsample); // computed once here (kept with the table) so the first look is quick
    post({ type: 'ready', ms: performance.now() - t0 });
    return { upsample };
  })();
  return tables;
}

function spectraOf(view: PhotoLookView, e: LookEdits): LookSpectra {
  const bare = view.light.edit && e.kelvin !== undefined ? resolveLight(editedLightSource(view.light.edit, e.kelvin)) : makeSpectrum(view.light.values);
  return {
    bareLight: bare,
    filters: view.filters.map((f, i) => {
      const nm = e.filterNm?.[i];
      return { on: f.on, spectrum: f.edit && nm !== undefined ? resolveFilter(editedFilterSource(f.edit, nm)) : makeSpectrum(f.values) };
    }),
    medium: makeSpectrum(view.medium.values),
    mediumToneId: view.mediumToneId,
    tone: view.tone as ToneSettings & { keyZone: number },
    key: view.key ? makeSpectrum(view.key) : null,
  };
}

/** Tables kept for the CPU fallback, most recent first. */
const built: { key: string; lut: ExposureLut; tone: ToneCurveTable; plan?: LutPlan8; zonePlan?: LutPlan8 }[] = [];
const photos = new Map<string, { width: number; height: number; rgba: Uint8ClampedArray }>();

/** Tone tables of key-less looks, kept across edits of the light and filters (shared/photo/preview-lut.ts). */
const tones: PreviewToneCache = new Map();

async function onLook(m: Extract<ToWorker, { type: 'look' }>) {
  const { upsample } = await loadTables();
  const t0 = performance.now();
  const look = previewLook(spectraOf(m.view, m.edits), upsample, tones);
  // the full table touches most nodes (filled at once); a dragging slider's small one only its cells' nodes
  const lut = previewStopsLut(upsample, look.nodes, m.size, m.size >= PREVIEW_LUT_SIZE);
  const tone = look.tone;
  built.unshift({ key: m.key, lut, tone });
  built.length = Math.min(built.length, 24);
  for (const old of built.slice(2)) old.plan = old.zonePlan = undefined;
  const { gpu, grey } = previewGpuTable(lut, tone);
  const out: PreviewLut = {
    key: m.key,
    size: lut.size,
    quality: m.size >= PREVIEW_LUT_SIZE ? 'full' : 'drag',
    stops: lut.stops.slice(),
    grey,
    gpu,
    tone: { minStops: tone.minStops, step: tone.step, grey: tone.grey.slice(), offsetStops: tone.offsetStops },
    ms: performance.now() - t0,
  };
  post({ type: 'lut', id: m.id, lut: out }, [out.stops.buffer, out.grey.buffer, out.tone.grey.buffer, gpu.grey.buffer, gpu.stops.buffer]);
}

/** Zone index 0..12 per pixel for the fallback's zone map: 0 = under zone 0, 1..11 = zones 0..X, 12 = over X. */
function zoneTone(tone: ToneCurveTable): ToneCurveTable {
  const grey = new Float32Array(tone.grey.length);
  for (let i = 0; i < grey.length; i++) {
    const z = 5 + tone.minStops + i * tone.step + tone.offsetStops;
    grey[i] = (z < -0.5 ? 0 : z > 10.5 ? 12 : Math.round(z) + 1) / 255;
  }
  return { ...tone, grey };
}

function onApply(m: Extract<ToWorker, { type: 'apply' }>) {
  const b = built.find((x) => x.key === m.key);
  const p = photos.get(m.photoKey);
  if (!b || !p) throw new Error('the table or the photo is not loaded');
  const t0 = performance.now();
  b.plan ??= planLut8(b.lut, b.tone, 8);
  const n = p.width * p.height;
  const grey = new Uint8Array(n);
  applyLut8(b.plan, p.rgba, 4, grey, 0, n);
  let zone: Uint8Array | null = null;
  if (m.zones) {
    b.zonePlan ??= planLut8(b.lut, zoneTone(b.tone), 8);
    zone = new Uint8Array(n);
    applyLut8(b.zonePlan, p.rgba, 4, zone, 0, n);
  }
  post({ type: 'applied', id: m.id, key: m.key, grey, zone, ms: performance.now() - t0 }, zone ? [grey.buffer, zone.buffer] : [grey.buffer]);
}

self.onmessage = async (e: MessageEvent<ToWorker>) => {
  const m = e.data;
  try {
    if (m.type === 'look') await onLook(m);
    else if (m.type === 'photo') photos.set(m.photoKey, { width: m.width, height: m.height, rgba: m.rgba });
    else if (m.type === 'apply') onApply(m);
  } catch (err) {
    post({ type: 'error', id: 'id' in m ? m.id : 0, message: err instanceof Error ? err.message : String(err) });
  }
};
void loadTables();
