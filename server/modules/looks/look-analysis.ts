/**
 * What the bench shows of a look: every curve of its light path and their product on the grid, and the
 * filter factor for its own light and for daylight and tungsten (the factor changes with the light).
 * Composition of engine results only (shared/spectral/compute, shared/tone/tone-pipeline).
 */
import { filterFactor, resolveLight, resolveMedium, type FilterFactor } from '../../../shared/spectral/compute';
import { GRID_NM_LIST } from '../../../shared/spectral/grid';
import { libraryLight } from '../../../shared/spectral/library';
import { buildTonePipeline } from '../../../shared/tone/tone-pipeline';
import type { FactorForLight, LookAnalysis, PathCurve } from '../../../shared/schemas/look';
import type { ToneSettings } from '../../../shared/schemas/exposure';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { ResolvedLook } from '../tones/look-resolve';


/** Library ids of the two reference lights the factor is also given for. */
export const DAYLIGHT_ID = 'd65';
export const TUNGSTEN_ID = 'tungsten-3200';

const values = (s: Spectrum, k = 1) => Array.from(s.values, (v) => Number((v * k).toPrecision(5)));

function factorFor(label: string, f: FilterFactor): FactorForLight {
  return { light: label, factor: f.factor, stops: f.stops, opaque: f.opaque };
}

let refLights: { daylight: Spectrum; tungsten: Spectrum } | null = null;
let eye: Spectrum | null = null;

/** The analysis of a resolved look (all numbers straight from the engine). */
export function analyseLook(r: ResolvedLook, tone: ToneSettings, t0 = performance.now()): LookAnalysis {
  refLights ??= { daylight: resolveLight({ id: DAYLIGHT_ID }), tungsten: resolveLight({ id: TUNGSTEN_ID }) };
  eye ??= resolveMedium({ id: 'eye' });
  const all = r.filters.map((f) => f.spectrum);
  const curves: PathCurve[] = [
    { role: 'light', label: r.bareLight.label, source: r.bareLight.source, values: values(r.bareLight.spectrum) },
    ...r.filters.map((f) => ({ role: 'filter' as const, label: f.label, source: f.source, on: f.on, values: values(f.spectrum) })),
    { role: 'medium', label: r.medium.label, source: r.medium.source, values: values(r.medium.spectrum) },
    { role: 'eye', label: 'Eye (CIE ȳ), for reference', source: 'CIE 015:2018, 1931 2° observer', values: values(eye) },
  ];
  const product = r.bareLight.spectrum.values.map((e, i) => e * r.medium.spectrum.values[i] * all.reduce((p, t) => p * t.values[i], 1));
  const top = product.reduce((m, v) => Math.max(m, v), 0);
  curves.push({
    role: 'product',
    label: 'Light × filters × medium',
    source: 'product of the curves above, normalised to its peak',
    values: Array.from(product, (v) => Number((top > 0 ? v / top : 0).toPrecision(5))),
  });
  const pipeline = buildTonePipeline({ mediumId: r.mediumToneId, settings: tone });
  return {
    nm: [...GRID_NM_LIST],
    curves,
    factor: factorFor(r.bareLight.label, r.factor),
    daylight: factorFor(libraryLight(DAYLIGHT_ID)?.name ?? 'Daylight', filterFactor(refLights.daylight, all, r.medium.spectrum)),
    tungsten: factorFor(libraryLight(TUNGSTEN_ID)?.name ?? 'Tungsten', filterFactor(refLights.tungsten, all, r.medium.spectrum)),
    toneKind: pipeline.defaults.kind,
    ratedEI: pipeline.ratedEI,
    ms: performance.now() - t0,
  };
}
