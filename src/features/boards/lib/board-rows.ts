/**
 * A board's rows: its swatches joined with their tones through each look shown (and whom they merge with),
 * and the orders the chips can be laid out in. Pure; the board page and its table read these.
 */
import type { BoardView, LookTones } from '../../../../shared/schemas/board';
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
  return swatchIds.map((id) => {
    const s = swatchById.get(id);
    const per: BoardRow['looks'] = {};
    for (const l of looks) {
      const t = l.tones.find((x) => x.swatchId === id);
      if (t) per[l.lookId] = { tone: t, mergesWith: l.merges.filter((m) => m.a === id || m.b === id).map((m) => swatchName(swatchById, m.a === id ? m.b : m.a)) };
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

/** Ids of the swatches that merge with another through `look`. */
export function mergedIds(look: LookTones | undefined): Set<number> {
  return new Set((look?.merges ?? []).flatMap((m) => [m.a, m.b]));
}

/** Merges flagged over all the looks shown. */
export const mergeCount = (looks: readonly LookTones[]) => looks.reduce((n, l) => n + l.merges.length, 0);

/** Whether the looks or thresholds chosen differ from the board's saved ones. */
export function settingsDirty(b: BoardView, lookIds: readonly number[], t: { mergeStops: number; mergeDeltaE: number }): boolean {
  return JSON.stringify(lookIds) !== JSON.stringify(b.lookIds) || t.mergeStops !== b.mergeStops || t.mergeDeltaE !== b.mergeDeltaE;
}

/** A file name for the board's exports: lower case, runs of other characters as one hyphen. */
export const boardFileName = (name: string) => name.replace(/[^a-z0-9]+/gi, '-').toLowerCase();
