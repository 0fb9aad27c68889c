/**
 * Demo looks, swatches and boards for the invented demo production. Every colour, name and "measured"
 * spectrum here is invented (the measured ones are smooth curves made up for the demo and say so).
 * Checked against the engine by tests/api/boards.test.ts: each board has at least one pair that merges
 * through one look and not through another.
 */
import type { EntityManager } from 'typeorm';
import { Look } from '../entities/look.entity';
import { Swatch } from '../entities/swatch.entity';
import { Board } from '../entities/board.entity';
import type { Production } from '../entities/production.entity';
import type { Membership } from '../entities/membership.entity';
import type { Department } from '../../../shared/schemas/roles';
import { toneSettingsSchema } from '../../../shared/schemas/exposure';
import type { LookFilter, LookLight, LookMedium } from '../../../shared/schemas/look';
import { resolveSwatchOrigin } from '../../modules/swatches/swatches.service';
import { getUpsampleTable } from '../../services/upsample-table';
import { DEMO_MODELLED_BOARD, DEMO_MODELLED_SWATCHES } from './modelled-makeup';

interface DemoLook {
  name: string;
  notes: string;
  light: LookLight;
  filters: LookFilter[];
  medium: LookMedium;
}

/** A demo look from built-in ids: the medium, the filters on the lens (in order) and the light (default 3200 K tungsten). */
function demoLook(name: string, notes: string, mediumId: string, lensFilterIds: string[] = [], lightId = 'tungsten-3200'): DemoLook {
  return {
    name,
    notes,
    light: { source: { id: lightId } },
    filters: lensFilterIds.map((id) => ({ filter: { source: { id } }, on: 'lens' })),
    medium: { source: { id: mediumId } },
  };
}

/** The demo looks: a 1930s studio lit with tungsten, on three media/filter choices, and one daylight exterior. */
export const DEMO_LOOKS: DemoLook[] = [
  demoLook('Panchromatic, no filter', 'Studio interiors under 3200 K tungsten on the panchromatic negative. The reference look. (Invented demo.)', 'panchromatic'),
  demoLook('Panchromatic + red-absorbing cyan', 'The same, with the red-absorbing cyan on the lens: reds and warm skin go darker, lips read strongly. (Invented demo.)', 'panchromatic', ['cyan-530']),
  demoLook('Orthochromatic', 'A red-blind emulsion under the same tungsten: the period rendering of reds as near black. (Invented demo.)', 'orthochromatic'),
  demoLook('Daylight exterior, yellow', 'Village exteriors in D65 daylight through the yellow long-pass, for the snow and sky. (Invented demo.)', 'panchromatic', ['yellow-490'], 'd65'),
];

/** An invented smooth reflectance at 10 nm: base + rise·logistic((nm − edge)/width); made up for the demo, not measured. */
function inventedReflectance(base: number, rise: number, edgeNm: number, widthNm: number): [number, number][] {
  const out: [number, number][] = [];
  for (let nm = 380; nm <= 780; nm += 10) out.push([nm, Number((base + rise / (1 + Math.exp(-(nm - edgeNm) / widthNm))).toFixed(4))]);
  return out;
}

type DemoSwatch = [name: string, hexOrMeasured: string | [number, number][], notes?: string];

const MEASURED_NOTE = 'Invented “measured” reflectance for the demo (a made-up smooth curve), not a real measurement.';

/** The demo boards, one per department, with their swatches (≥ 8 each; all invented). */
export const DEMO_BOARDS: { department: Department; name: string; notes: string; swatches: DemoSwatch[] }[] = [
  {
    department: 'makeup',
    name: 'Principal makeup',
    notes: 'Bases, lips, cheeks, blood and greasepaint for the clockmaker and his daughter. (Invented demo.)',
    swatches: [
      ['Base, fair', '#e8c4a8'],
      ['Base, warm medium', '#c99470'],
      ['Base, deep', '#7a4e35'],
      ['Lip colour, deep rose', '#a33b4a'],
      ['Lip colour, brick red', '#9e3a2a'],
      ['Lip colour, plum', '#6e2f45'],
      ['Cheek, flushed', '#d98a80'],
      ['Stage blood', '#7a1010'],
      ['Greasepaint, bruise blue', '#4f5a7a'],
      ['Eye shadow, brown', '#6b4a3a'],
      ['Lip colour, test sample (measured)', inventedReflectance(0.05, 0.45, 610, 18), MEASURED_NOTE],
    ],
  },
  {
    department: 'costume',
    name: 'Workshop wardrobe',
    notes: 'Fabrics for the workshop scenes. (Invented demo.)',
    swatches: [
      ['Navy wool coat', '#2b3552'],
      ['Bottle-green velvet', '#2f5a3c'],
      ['Burgundy silk', '#7a2335'],
      ['Mustard tweed', '#b8923a'],
      ['Grey flannel', '#7d7d7a'],
      ['Cream linen', '#e6dcc3'],
      ['Black wool', '#1e1c1c'],
      ['Rust corduroy', '#9a4a28'],
      ['Royal-blue satin', '#3556a8'],
      ['Moss-green knit', '#6f7a3e'],
      ['Apron canvas (measured)', inventedReflectance(0.2, 0.25, 520, 40), MEASURED_NOTE],
    ],
  },
  {
    department: 'art',
    name: 'Set paint, clock workshop',
    notes: 'Wall paints, trims and lacquers for the workshop set. (Invented demo.)',
    swatches: [
      ['Workshop wall, warm white', '#ece4d2'],
      ['Bright white trim', '#f7f7f4'],
      ['Duck-egg blue', '#a9c4c0'],
      ['Sage green', '#9aa68a'],
      ['Ochre limewash', '#c9a05a'],
      ['Oxblood lacquer', '#5e1e1e'],
      ['Charcoal', '#3a3a3c'],
      ['Warm grey', '#8a847a'],
      ['Lacquer red', '#b0302a'],
      ['Forest green', '#2f4a35'],
      ['Grey card, 18 % (measured)', inventedReflectance(0.18, 0, 550, 10), 'Invented flat 18 % reflectance: the middle-grey reference card.'],
    ],
  },
];

/** Which demo member files each department's swatches and boards. */
const OWNER_OF: Record<string, string> = { makeup: 'makeup@demo.grisaille.test', costume: 'costume@demo.grisaille.test', art: 'art@demo.grisaille.test' };

/**
 * Seeds the demo looks, swatches and boards inside the demo seed's transaction; the modelled makeup board's
 * paints are colour values, so it loads the colour estimate's table from `dataDir`.
 */
export async function seedLooksAndBoards(t: EntityManager, production: Production, members: Record<string, Membership>, dataDir: string): Promise<void> {
  const camera = members['camera@demo.grisaille.test']?.user ?? null;
  const tone = toneSettingsSchema.parse({});
  const looks: Look[] = [];
  for (const l of DEMO_LOOKS) looks.push(await t.save(Look, t.create(Look, { production, ...l, tone, createdBy: camera })));
  const tungstenLooks = looks.slice(0, 3).map((l) => l.id);
  for (const b of DEMO_BOARDS) {
    const by = members[OWNER_OF[b.department]]?.user ?? camera;
    const swatches: Swatch[] = [];
    for (const [name, given, notes] of b.swatches) {
      const resolved = typeof given === 'string'
        ? resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex: given } })
        : resolveSwatchOrigin({ type: 'measured', basis: 'fraction', table: { samples: given, fileName: undefined } });
      swatches.push(await t.save(Swatch, t.create(Swatch, { production, department: b.department, name, notes: notes ?? 'Invented demo colour.', ...resolved, createdBy: by })));
    }
    await t.save(Board, t.create(Board, { production, department: b.department, name: b.name, notes: b.notes, lookIds: tungstenLooks, mergeStops: 1 / 3, mergeDeltaE: 10, swatches, createdBy: by }));
  }
  const makeupBy = members[OWNER_OF.makeup]?.user ?? camera;
  const table = await getUpsampleTable(dataDir);
  const modelled: Swatch[] = [];
  for (const m of DEMO_MODELLED_SWATCHES) {
    const resolved = resolveSwatchOrigin(m.origin, 'origin', table);
    modelled.push(await t.save(Swatch, t.create(Swatch, { production, department: 'makeup', name: m.name, notes: m.notes, ...resolved, createdBy: makeupBy })));
  }
  await t.save(Board, t.create(Board, { production, department: 'makeup', ...DEMO_MODELLED_BOARD, lookIds: tungstenLooks, mergeStops: 1 / 3, mergeDeltaE: 10, swatches: modelled, createdBy: makeupBy }));
}
