/**
 * The demo's modelled makeup board: skin tones, a flush, bruises, stage blood and two lip colours made with
 * the skin and makeup model (shared/spectral/skin.ts, makeup.ts; the presets of skin-presets.ts) rather than
 * from hex colours, so the red-blind rendering of skin shows at first sign-in: through the red-absorbing
 * cyan and on the orthochromatic medium the flush and the blood read darker against calm skin than on the
 * panchromatic medium without a filter. The lips and the lip colours are invented for the demo.
 */
import type { SwatchOriginInput } from '../../../shared/schemas/swatch';
import type { SkinParams } from '../../../shared/spectral/sources';
import { BLOOD_PRESETS, CALM_SKIN, SKIN_PRESETS } from '../../../shared/spectral/skin-presets';

export interface DemoModelledSwatch {
  name: string;
  notes: string;
  origin: SwatchOriginInput;
}

/** A skin preset by id, as a swatch (its name and note from the preset). */
function skinPreset(id: string, name?: string): DemoModelledSwatch {
  const p = SKIN_PRESETS.find((x) => x.id === id);
  if (!p) throw new Error(`no skin preset ${id}`);
  return { name: name ?? p.name, notes: `Skin model, preset "${p.name}": ${p.note}. (Invented demo.)`, origin: { type: 'skin', skin: p.skin } };
}

/** A stage-blood preset by id, as a makeup swatch. */
function bloodPreset(id: string): DemoModelledSwatch {
  const p = BLOOD_PRESETS.find((x) => x.id === id);
  if (!p) throw new Error(`no blood preset ${id}`);
  return { name: p.name, notes: `Makeup over skin, preset "${p.name}": ${p.note}. (Invented demo.)`, origin: { type: 'makeup', makeup: p.makeup } };
}

/** The lip: the calm light skin with more blood, more oxygenated (invented demo values). */
const LIP: SkinParams = { ...CALM_SKIN, blood: 0.12, oxygenation: 0.85 };

/** A lip colour (an invented hex paint, its spectrum estimated) on the lip. */
const lipColour = (name: string, hex: string, coverage: number): DemoModelledSwatch => ({
  name,
  notes: `Lip colour ${hex} over the lip (skin model, blood 12 %), coverage ${coverage}. Invented demo colour.`,
  origin: { type: 'makeup', makeup: { over: { skin: LIP }, colour: hex, coverage } },
});

/** The board's swatches, in order. */
export const DEMO_MODELLED_SWATCHES: DemoModelledSwatch[] = [
  skinPreset('skin-light'),
  skinPreset('skin-tan'),
  skinPreset('skin-dark'),
  skinPreset('skin-flushed', 'Flushed cheek'),
  skinPreset('skin-pale'),
  skinPreset('skin-bruise-fresh'),
  skinPreset('skin-bruise-old'),
  bloodPreset('blood-fresh'),
  bloodPreset('blood-dried'),
  lipColour('Lip colour, deep rose, on the lip', '#a33b4a', 0.85),
  lipColour('Lip colour, brick red, on the lip', '#9e3a2a', 0.85),
];

export const DEMO_MODELLED_BOARD = {
  name: 'Skin and blood, modelled',
  notes: 'Skin tones, a flush, bruises, stage blood and two lip colours from the skin and makeup model, through the tungsten looks: the red-blind rendering of skin at a glance. (Invented demo.)',
};
