/**
 * The exposure sheet PDF's light budget between looks: a small bar chart, one bar per look of the
 * production, its length the light the look needs against the first look (POST …/looks/light-budget,
 * LooksService.sheetLightBudget), this sheet's look in the accent colour, the reference marked at 1×.
 * The same chart as the page's (src/components/ui/light-budget-chart.tsx), in the sheet's colours.
 */
import { C, PAGE, type Faces } from './sheet-pdf-style';
import type { ExposureSheet } from '../../../shared/schemas/sheet';
import { asciiFractions, formatEI, formatFootcandles, formatSeconds, formatStopsLabel, formatTStop } from '../../../shared/tone/exposure-format';
import { formatRelative, relativeLightPhrase } from '../../../shared/tone/light-budget';

/** A sheet with its light budget (filled by the sheets service from LooksService.sheetLightBudget). */
export type SheetWithLightBudget = ExposureSheet;

/** A round top for the scale: 1, 2, 4, 5, 10, 20 … at or above `v` (as the page's chart). */
function scaleTop(v: number): number {
  const p = 10 ** Math.floor(Math.log10(Math.max(v, 1)));
  return ([1, 2, 4, 5, 10].find((s) => s * p >= v - 1e-9) ?? 10) * p;
}

const ROW_H = 15;

/**
 * Draws the light budget from `y` (adding a page when it does not fit) and answers the y after it; draws
 * nothing (answers `y`) when the sheet carries no budget, its look has no exposure index or the
 * production has one look.
 */
export function drawSheetLightBudget(doc: PDFKit.PDFDocument, sheet: SheetWithLightBudget, faces: Faces, y0: number): number {
  const b = sheet.lightBudget;
  if (!b || !sheet.chain || b.looks.length < 2) return y0;
  const L = PAGE.margin;
  const W = doc.page.width - 2 * PAGE.margin;
  const opts = (o: PDFKit.Mixins.TextOptions = {}, num = false): PDFKit.Mixins.TextOptions => ({ features: faces.inter ? (num ? ['tnum', 'kern'] : ['kern']) : undefined, lineBreak: true, ...o });
  const font = (bold: boolean, size: number, color = C.ink) => doc.font(bold ? faces.bold : faces.reg).fontSize(size).fillColor(color);
  const t = asciiFractions;
  const ref = b.looks[0];
  const mine = b.looks.find((l) => l.lookId === sheet.look.id);
  const sentence = !mine || mine.relative === null ? null
    : mine.lookId === ref.lookId ? 'This look is the reference of the production’s light budget.'
    : `This look ${relativeLightPhrase(mine.relative)} ${ref.name}.`;
  const cam = b.camera;
  const caption = `Bars: light needed against ${ref.name} (dashed line, 1×), from the effective EIs (box speed, rating and development, every filter for its own light and medium). Foot-candles incident at ${formatTStop(cam.tStop)}, ${cam.fps} fps, ${cam.shutterAngle}° (${formatSeconds(cam.exposureSeconds)}), meter constant ${cam.calibrationConstant}, after ISO 2720.`;
  const captionH = font(false, 7.5).heightOfString(t(caption), opts({ width: W }));
  const need = 12 + (sentence ? 16 : 0) + b.looks.length * ROW_H + captionH + 16;
  let y = y0;
  if (y + need > doc.page.height - PAGE.margin - 14) {
    doc.addPage();
    y = PAGE.margin;
  }

  font(true, 8, C.accent).text('LIGHT BUDGET BETWEEN LOOKS', L, y, opts({ characterSpacing: 0.8, width: W }));
  y += 12;
  if (sentence) {
    font(true, 9.5).text(t(sentence), L, y, opts({ width: W }));
    y = doc.y + 4;
  }
  const nameW = 150;
  const figW = 170;
  const x0 = L + nameW + 6;
  const barW = W - nameW - figW - 12;
  const top = scaleTop(Math.max(1, ...b.looks.map((l) => l.relative ?? 0)));
  const at = (v: number) => x0 + Math.min(1, v / top) * barW;
  b.looks.forEach((l, i) => {
    const own = l.lookId === sheet.look.id;
    font(own, 8.5, own ? C.accent : C.ink).text(t(l.name), L, y + 3, opts({ width: nameW, lineBreak: false, ellipsis: true, height: ROW_H }));
    doc.rect(x0, y + 3, barW, 9).fill(C.sunk);
    if (l.relative !== null) doc.rect(x0, y + 3, at(l.relative) - x0, 9).fill(own ? C.accent : i === 0 ? C.mute : C.soft);
    doc.moveTo(at(1), y + 1).lineTo(at(1), y + 14).lineWidth(0.6).dash(1.5, { space: 1.5 }).strokeColor(C.ink).stroke().undash();
    const fx = x0 + barW + 6;
    if (l.relative === null) {
      font(false, 7.5, C.mute).text('no exposure index (the eye)', fx, y + 4, opts({ width: figW }));
    } else {
      font(true, 9.5, own ? C.accent : C.ink).text(formatRelative(l.relative), fx, y + 2, opts({ width: 36, align: 'right' }, true));
      const detail = `${i === 0 ? 'reference' : l.opaque ? 'opaque filter' : formatStopsLabel(l.stops!)} · ${formatEI(l.effectiveEI!)} · ${formatFootcandles(l.footcandles!)}`;
      font(false, 7.5, C.soft).text(t(detail), fx + 42, y + 4, opts({ width: figW - 42, lineBreak: false }, true));
    }
    y += ROW_H;
  });
  font(false, 7.5, C.mute).text(t(caption), L, y + 3, opts({ width: W }));
  return doc.y + 12;
}
