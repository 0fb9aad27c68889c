/**
 * A board's rows: its swatches joined with their tones through each look shown (and whom they merge with),
 * and the orders the chips can be laid out in. Pure; the board page and its table read these.
 */
import type { BoardView, LookTones } from '../../../../shared/schemas/board';
import { mergeNames, mergesById, type MergeCertainty } from '../../../lib/merge-names';
export type { MergeCertainty };
import { isExact, MEASURE_FIRST_WIDTH, widthOf } from '../../../lib/tone-range';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import type { BoardRow } from '../components/board-table';

export type BoardSort = 'tone' | 'name' | 'eye';
type SwatchLike = Pick<SwatchView, 'id' | 'name' | 'department' | 'hex' | 'spectrum'>;

/** The looks of `all` that are shown: those in `lookIds`, or every one when none is chosen. */
export function shownLooksOf(all: readonly LookTones[], lookIds: readonly number[]): LookTones[] {
  return all.filter((l) => !lookIds.length || lookIds.includes(l.lookId));
}

/** Name of a swatch by id (`#id` when it is not known). */
export const swatchName = (swatchById: ReadonlyMap<number, SwatchLike>, id: number) => swatchById.get(id)?.name ?? `#${id}`;


/** One row per swatch on the board, in the board's order: its tone through each look and the names it merges with there. */
export function boardRows(swatchIds: readonly number[], swatchById: ReadonlyMap<number, SwatchLike>, looks: readonly LookTones[]): BoardRow[] {
  const nameOf = (id: number) => swatchName(swatchById, id);
  const perLook = looks.map((l) => ({ l, tone: new Map(l.tones.map((t) => [t.swatchId, t])), merges: mergesById(l) }));
  return swatchIds.map((id) => {
    const s = swatchById.get(id);
    const per: BoardRow['looks'] = {};
    for (const { l, tone, merges } of perLook) {
      const t = tone.get(id);
      if (!t) continue;
      per[l.lookId] = { tone: t, ...mergeNames(merges.get(id), nameOf) };
    }
    return { id, name: s?.name ?? `#${id}`, department: s?.department ?? '', hex: s?.hex ?? '#000000', spectrum: s?.spectrum ?? 'estimated', looks: per };
  });
}

/** The rows by name, or light to dark by tone on the medium (or to the eye) through look `lookId`; rows without a tone go last. */
export function sortRows(rows: readonly BoardRow[], sort: BoardSort, lookId: number | undefined): BoardRow[] {
  const r = [...rows];
  if (sort === 'name') r.sort((x, y) => x.name.localeCompare(y.name));
  else if (lookId !== undefined) {
    const key = (row: BoardRow) => (sort === 'eye' ? row.looks[lookId]?.tone.eyeStops : row.looks[lookId]?.tone.stops) ?? -99;
    r.sort((x, y) => key(y) - key(x));
  }
  return r;
}

/** How sure a merge is, per swatch id through `look`: 'certain' when any of its merges is, else 'possible'. */
export function mergedIds(look: LookTones | undefined): Map<number, MergeCertainty> {
  return new Map((look?.merges ?? []).map((m) => [m.swatchId, m.certainCount > 0 ? 'certain' : 'possible']));
}

/** Two swatches that merge through a look: a < b by id, how far apart on the medium and to the eye. */
export interface MergePair {
  a: number;
  b: number;
  certainty: MergeCertainty;
  /** |stops a − stops b| on the medium */
  stopsApart: number;
  /** CIEDE2000 to the eye */
  deltaE: number;
}

/**
 * The pairs a look's per-swatch partner lists name (each once), certain ones first, each kind closest on
 * the medium first. The server lists a few partners per swatch, so this can be fewer than the look's
 * `mergeCount`; the counts say how many there are in all.
 */
export function mergePairs(look: LookTones): MergePair[] {
  const stops = new Map(look.tones.map((t) => [t.swatchId, t.stops]));
  const seen = new Map<string, MergePair>();
  for (const m of look.merges) {
    for (const p of m.partners) {
      const [a, b] = m.swatchId < p.swatchId ? [m.swatchId, p.swatchId] : [p.swatchId, m.swatchId];
      const key = `${a}-${b}`;
      if (!seen.has(key)) seen.set(key, { a, b, certainty: p.certain ? 'certain' : 'possible', stopsApart: Math.abs((stops.get(a) ?? 0) - (stops.get(b) ?? 0)), deltaE: p.deltaE });
    }
  }
  return [...seen.values()].sort((x, y) => (x.certainty === y.certainty ? x.stopsApart - y.stopsApart : x.certainty === 'certain' ? -1 : 1));
}

/** Merges flagged over all the looks shown: certain ones and possible ones (pairs, from the server's counts). */
export const mergeCount = (looks: readonly LookTones[]) =>
  looks.reduce((n, l) => ({ certain: n.certain + l.certainMergeCount, possible: n.possible + l.mergeCount - l.certainMergeCount }), { certain: 0, possible: 0 });

/** A swatch worth measuring: its widest plausible range over the looks shown, and through which look. */
export interface MeasureFirst {
  id: number;
  name: string;
  widthStops: number;
  lookName: string;
}

/**
 * The estimated swatches whose plausible range is widest through any of the looks (at least
 * MEASURE_FIRST_WIDTH stops), widest first, at most `max`: measuring these settles the most.
 */
export function measureFirst(rows: readonly BoardRow[], looks: readonly LookTones[], max = 5): MeasureFirst[] {
  const out: MeasureFirst[] = [];
  for (const r of rows) {
    let best: MeasureFirst | null = null;
    for (const l of looks) {
      const t = r.looks[l.lookId]?.tone;
      if (!t || isExact(t.range)) continue;
      const w = widthOf(t.range.plausible);
      if (w >= MEASURE_FIRST_WIDTH && (!best || w > best.widthStops)) best = { id: r.id, name: r.name, widthStops: w, lookName: l.lookName };
    }
    if (best) out.push(best);
  }
  return out.sort((a, b) => b.widthStops - a.widthStops).slice(0, max);
}

/** Whether the looks or thresholds chosen differ from the board's saved ones. */
export function settingsDirty(b: BoardView, lookIds: readonly number[], t: { mergeStops: number; mergeDeltaE: number }): boolean {
  return JSON.stringify(lookIds) !== JSON.stringify(b.lookIds) || t.mergeStops !== b.mergeStops || t.mergeDeltaE !== b.mergeDeltaE;
}

/** A file name for the board's exports: lower case, runs of other characters as one hyphen. */
export const boardFileName = (name: string) => name.replace(/[^a-z0-9]+/gi, '-').toLowerCase();
