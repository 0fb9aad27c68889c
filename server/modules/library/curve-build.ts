/**
 * A curve's origin as given → its samples on the grid in the engine's basis, and a line saying where it
 * came from. Tables are read by the shared readers (a CSV-like table, or one sample of a CGATS.17 / Argyll
 * file, shared/import/spectral-table.ts) and converted by the engine's basis readers;
 * parametric filters and lights through gels are made by the engine's own resolvers.
 */
import type { EntityManager } from 'typeorm';
import { InvalidError } from '../../errors';
import { filterFromPairs, lightFromPairs, mediumFromPairs, type FilterBasis, type MediumBasis } from '../../../shared/spectral/bases';
import { resolveFilter } from '../../../shared/spectral/compute';
import { lightThroughGel } from '../../../shared/spectral/lights';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { toPairs, type Spectrum } from '../../../shared/spectral/spectrum';
import { CURVE_BASIS_LABELS, type CurveBasis, type CurveKind, type CurveOrigin, type CurveOriginInput } from '../../../shared/schemas/curve';
import { loadCurves, resolveFilterRef, resolveLightRef } from '../tones/look-resolve';
import { readTable, withTableErrors } from './table-input';

export interface BuiltCurve {
  origin: CurveOrigin;
  samples: [number, number][];
  source: string;
}

const round = (s: Spectrum): [number, number][] => toPairs(s).map(([nm, v]) => [nm, Number(v.toPrecision(7))]);

function describeParametric(f: CurveOriginInput & { type: 'parametric' }): string {
  const p = f.filter;
  const extra = (o: { slopeNm?: number; peak?: number }) => `${o.slopeNm !== undefined ? `, slope ${o.slopeNm} nm` : ''}${o.peak !== undefined ? `, peak ${o.peak}` : ''}`;
  if (p.longPass) return `parametric long-pass, cut-on ${p.longPass.cutOnNm} nm${extra(p.longPass)}`;
  if (p.shortPass) return `parametric short-pass, cut-off ${p.shortPass.cutOffNm} nm${extra(p.shortPass)}`;
  if (p.bandPass) return `parametric band-pass, centre ${p.bandPass.centreNm} nm, width ${p.bandPass.widthNm} nm${extra(p.bandPass)}`;
  if (p.notch) return `parametric notch, centre ${p.notch.centreNm} nm, width ${p.notch.widthNm} nm${extra(p.notch)}`;
  return `neutral density ${p.neutralDensity}`;
}

/** What to say about a basis whose converted values overflowed. */
const OVERFLOW_HINT: Partial<Record<CurveBasis, string>> = {
  log10: ' (log10 sensitivities lie around −3 to 3; if these are plain sensitivities, choose the basis "energy", relative sensitivity)',
  quantum: ' (the values are too large to scale by wavelength)',
  density: ' (optical densities lie around 0 to 10)',
};

/**
 * Refuses a converted curve any of whose samples is not a finite number (a log10 sensitivity of 400 is
 * 10^400, which overflows; normalising an infinite peak gives NaN): such samples would be stored and sent
 * as nulls, and every look using the curve would compute nothing. 400 on `field`.
 */
function assertFinite(spectrum: Spectrum, field: string, basis: CurveBasis | null): void {
  const bad = spectrum.values.reduce((n, v) => (Number.isFinite(v) ? n : n + 1), 0);
  if (!bad) return;
  const all = bad === spectrum.values.length || spectrum.values.every((v) => !Number.isFinite(v) || v === 0);
  throw new InvalidError(
    `${field}: ${all ? 'no value of the curve' : `${bad} of the curve's ${spectrum.values.length} samples`} can be computed from these values${basis ? ` as ${CURVE_BASIS_LABELS[basis]}` : ''}; they overflow${basis ? (OVERFLOW_HINT[basis] ?? '') : ''}.`,
    field,
  );
}

/** Builds a curve of `kind` from its origin (inside the caller's transaction). Throws InvalidError naming the field. */
export async function buildCurve(em: EntityManager, productionId: number, kind: CurveKind, o: CurveOriginInput): Promise<BuiltCurve> {
  if (o.type === 'table') {
    const table = readTable(o.table, 'origin.table');
    const spectrum = withTableErrors(table, 'origin.table', (pairs) =>
      kind === 'filter' ? filterFromPairs(pairs, o.basis as FilterBasis) : kind === 'medium' ? mediumFromPairs(pairs, o.basis as MediumBasis) : lightFromPairs(pairs),
    );
    assertFinite(spectrum, table.lines ? 'origin.table.text' : 'origin.table.samples', o.basis);
    const nm = table.pairs.map((p) => p[0]);
    const range = `${Math.min(...nm)}–${Math.max(...nm)} nm`;
    const from = `${table.fileName ? `uploaded file ${table.fileName}` : table.cgats ? 'uploaded file' : 'pairs given through the API'}${table.cgats ? ` (${table.cgats.fileType}, sample "${table.cgats.sampleName}"${table.cgats.sampleCount > 1 ? ` of ${table.cgats.sampleCount}` : ''})` : ''}`;
    return {
      origin: { type: 'table', basis: o.basis, fileName: table.fileName, pairs: table.pairs, headers: table.headers.slice(0, 10) },
      samples: round(spectrum),
      source: `${from}: ${table.pairs.length} points over ${range}, ${CURVE_BASIS_LABELS[o.basis]}${table.decimalComma ? ', decimal commas' : ''}`,
    };
  }
  if (o.type === 'parametric') {
    let spectrum: Spectrum;
    try {
      spectrum = resolveFilter(o.filter);
    } catch (e) {
      if (e instanceof SpectralInputError) throw new InvalidError(`origin.filter: ${e.reason}`, 'origin.filter');
      throw e;
    }
    assertFinite(spectrum, 'origin.filter', null);
    return { origin: { type: 'parametric', filter: o.filter }, samples: round(spectrum), source: describeParametric(o) };
  }
  const curves = await loadCurves(em, productionId, [o.light, ...o.gels]);
  const light = resolveLightRef(o.light, curves, 'origin.light');
  const gels = o.gels.map((g, i) => resolveFilterRef(g, curves, `origin.gels.${i}`));
  let spectrum: Spectrum;
  try {
    spectrum = lightThroughGel(light.spectrum, ...gels.map((g) => g.spectrum));
  } catch (e) {
    if (e instanceof SpectralInputError) throw new InvalidError(`origin.gels: ${e.reason}`, 'origin.gels');
    throw e;
  }
  assertFinite(spectrum, 'origin.gels', null);
  return {
    origin: { type: 'gel', light: o.light, gels: o.gels },
    samples: round(spectrum),
    source: `${light.label} through ${gels.map((g) => g.label).join(' and ')}`,
  };
}
