/**
 * A swatch's merges through a look, in names, for the chips and tables that show them (the board page, the
 * looks compared side by side, the bench). The server names a few partners per swatch and counts them all
 * (shared/schemas/board.ts, SwatchMerges), so what is not named is said as "and N more".
 */
import type { LookTones, SwatchMerges } from '../../shared/schemas/board';

/** How sure a merge is: whatever the spectra (`certain`), or only for some plausible ones (`possible`). */
export type MergeCertainty = 'certain' | 'possible';

/** Whom one swatch merges with through one look, by name: those listed, and how many more the server counted. */
export interface MergeNames {
  mergesWith: string[];
  mayMergeWith: string[];
  /** certain / possible partners beyond those named (the server lists a few per swatch, with the full counts) */
  moreMerges: number;
  moreMayMerge: number;
}

/** A swatch's merges through a look, by name (see MergeNames); `m` undefined: it merges with none. */
export function mergeNames(m: SwatchMerges | undefined, nameOf: (id: number) => string): MergeNames {
  const listed = m?.partners ?? [];
  const mergesWith = listed.filter((p) => p.certain).map((p) => nameOf(p.swatchId));
  const mayMergeWith = listed.filter((p) => !p.certain).map((p) => nameOf(p.swatchId));
  const certain = m?.certainCount ?? 0;
  const possible = (m?.count ?? 0) - certain;
  return { mergesWith, mayMergeWith, moreMerges: certain - mergesWith.length, moreMayMerge: possible - mayMergeWith.length };
}

/** A look's merges per swatch id. */
export const mergesById = (look: Pick<LookTones, 'merges'> | undefined) => new Map((look?.merges ?? []).map((m) => [m.swatchId, m]));
