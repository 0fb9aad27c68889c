/**
 * Access to the published CIE tables in data/cie (each file names its source and units; checked by a
 * schema when it loads). Everything returned is on the working grid, resampled by policy.ts.
 */
import { z } from 'zod';
import observerJson from '../../data/cie/cie-1931-2deg.json';
import illuminantAJson from '../../data/cie/illuminant-a.json';
import illuminantD50Json from '../../data/cie/illuminant-d50.json';
import illuminantD65Json from '../../data/cie/illuminant-d65.json';
import illuminantF2Json from '../../data/cie/illuminant-f2.json';
import illuminantF7Json from '../../data/cie/illuminant-f7.json';
import illuminantF11Json from '../../data/cie/illuminant-f11.json';
import daylightJson from '../../data/cie/daylight-components.json';
import { GRID_NM } from './grid';
import { onWorkingGrid, spragueAt } from './policy';
import { makeSpectrum } from './spectrum';
import type { Spectrum } from './types';

const values = z.array(z.number()).min(3);
const header = { name: z.string().min(1), source: z.string().min(1), units: z.string().min(1), startNm: z.number(), stepNm: z.number().positive(), note: z.string().optional() };
const singleTable = z.object({ ...header, values });
const observerTable = z.object({ ...header, values: z.object({ x: values, y: values, z: values }) });
const daylightTable = z.object({ ...header, values: z.object({ s0: values, s1: values, s2: values }) });

/** A published table as it sits in data/cie, with its name, source and units. */
export type CieTable = z.infer<typeof singleTable>;

/** A published table onto the working grid: linear inside, its end values held beyond (CIE 167). */
function toGrid(startNm: number, stepNm: number, v: number[]): Spectrum {
  const nm = v.map((_, i) => startNm + i * stepNm);
  return makeSpectrum(onWorkingGrid(nm, v, 'hold'));
}

/** A smooth published function onto the working grid by Sprague's formula (CIE 167:2005), zero outside its table. */
function spragueToGrid(startNm: number, stepNm: number, v: number[]): Spectrum {
  const end = startNm + stepNm * (v.length - 1);
  return makeSpectrum(Array.from(GRID_NM, (nm) => (nm < startNm || nm > end ? 0 : spragueAt(startNm, stepNm, v, nm))));
}

/** The tabulated illuminants, by CIE name. */
export const CIE_TABLES = {
  A: singleTable.parse(illuminantAJson),
  D50: singleTable.parse(illuminantD50Json),
  D65: singleTable.parse(illuminantD65Json),
  F2: singleTable.parse(illuminantF2Json),
  F7: singleTable.parse(illuminantF7Json),
  F11: singleTable.parse(illuminantF11Json),
} as const;
export type CieTableName = keyof typeof CIE_TABLES;

const observer = observerTable.parse(observerJson);
const daylight = daylightTable.parse(daylightJson);

/** Name, source and units of the observer table (for the README and the library endpoint). */
export const OBSERVER_INFO = { name: observer.name, source: observer.source, units: observer.units };
/** Name, source and units of the daylight components table. */
export const DAYLIGHT_INFO = { name: daylight.name, source: daylight.source, units: daylight.units };

/**
 * CIE 1931 2° colour-matching functions x̄, ȳ, z̄ on the working grid (dimensionless; CIE 015:2018): the
 * 5 nm table interpolated to 1 nm by Sprague's formula (CIE 167:2005), zero outside 360–830 nm.
 */
export const CMF: { readonly x: Spectrum; readonly y: Spectrum; readonly z: Spectrum } = Object.freeze({
  x: spragueToGrid(observer.startNm, observer.stepNm, observer.values.x),
  y: spragueToGrid(observer.startNm, observer.stepNm, observer.values.y),
  z: spragueToGrid(observer.startNm, observer.stepNm, observer.values.z),
});

/** CIE daylight components S0, S1, S2 on the grid (relative power, S0 = 100 at 560 nm; CIE 015:2018). */
export const DAYLIGHT_COMPONENTS: { readonly s0: Spectrum; readonly s1: Spectrum; readonly s2: Spectrum } = Object.freeze({
  s0: toGrid(daylight.startNm, daylight.stepNm, daylight.values.s0),
  s1: toGrid(daylight.startNm, daylight.stepNm, daylight.values.s1),
  s2: toGrid(daylight.startNm, daylight.stepNm, daylight.values.s2),
});

/** A tabulated CIE illuminant as published (relative power, table scale), resampled to the grid. */
export function cieTable(name: CieTableName): Spectrum {
  const t = CIE_TABLES[name];
  return toGrid(t.startNm, t.stepNm, t.values);
}
