import type { CurveKind, CurveView, FilterRef, LightRef, MediumRef } from '../../../../shared/schemas/curve';

/** One choice in a light, filter or medium picker. `value` encodes the reference: `lib:<id>` or `curve:<id>`. */
export interface PathOption {
  value: string;
  label: string;
  group: 'Built-in' | 'This production';
  description?: string;
  /** values on the working grid, for the sparkline */
  values: number[];
}

export interface LibraryItemLike {
  id: string;
  kind: CurveKind;
  name: string;
  description: string;
  values: number[];
}

/** The built-in items and production curves of one kind as picker options. */
export function optionsFor(kind: CurveKind, library: LibraryItemLike[], curves: CurveView[]): PathOption[] {
  return [
    ...library.filter((i) => i.kind === kind).map((i) => ({ value: `lib:${i.id}`, label: i.name, group: 'Built-in' as const, description: i.description, values: i.values })),
    ...curves.filter((c) => c.kind === kind).map((c) => ({ value: `curve:${c.id}`, label: c.name, group: 'This production' as const, description: c.source, values: c.samples.map((p) => p[1]) })),
  ];
}

/** The light, filter and medium pickers' options from the built-in library and the production's curves. */
export function lookOptions(library: LibraryItemLike[] = [], curves: CurveView[] = []): Record<'light' | 'filter' | 'medium', PathOption[]> {
  return { light: optionsFor('light', library, curves), filter: optionsFor('filter', library, curves), medium: optionsFor('medium', library, curves) };
}

/** A picker value → a reference of the look. */
export function refOf(value: string): { curveId: number } | { source: { id: string } } {
  if (value.startsWith('curve:')) return { curveId: Number(value.slice(6)) };
  return { source: { id: value.slice(4) } };
}

/** A look's reference → the picker value ('' when it is an inline form the picker does not list). */
export function valueOf(ref: LightRef | FilterRef | MediumRef): string {
  if (ref.curveId !== undefined) return `curve:${ref.curveId}`;
  const id = (ref.source as { id?: string } | undefined)?.id;
  return id ? `lib:${id}` : '';
}
