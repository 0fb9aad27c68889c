/**
 * One look's exposure sheet drawn into a pdfkit document (sheets-pdf.ts makes the document): A4 portrait,
 * tabular figures, units on every number. Inter's latin subset lacks ⅓ ⅔ and →, so stops are written
 * "1 2/3" and arrows are drawn. The swatch table lists every swatch over as many pages as it takes, its
 * header repeated on each, with the thresholds drawn across it.
 */
import { C, PAGE, type Faces } from './sheet-pdf-style';
import { drawSheetLightBudget } from './sheet-pdf-light-budget';
import { NEAR_THRESHOLD_STOPS, SHEET_FLAG_WORDS, type ExposureSheet, type SheetFlag } from '../../../shared/schemas/sheet';
import { ZONE_NUMERALS } from '../../../shared/tone/zones';
import { asciiFractions, formatEI, formatFactor, formatFootcandles, formatLux, formatSeconds, formatStopsLabel, formatTStop } from '../../../shared/tone/exposure-format';

/** The app's zone ramp (tailwind.config.ts): zone 0..X at CIE L* 0, 10 … 100. */
const ZONE_GREYS = ['#000000', '#1b1b1b', '#303030', '#474747', '#5e5e5e', '#777777', '#919191', '#ababab', '#c6c6c6', '#e2e2e2', '#ffffff'];

/** A plausible range as zones, e.g. "III–V" (one numeral when it stays within one zone). */
function rangeWords(r: [number, number]): string {
  const lo = ZONE_NUMERALS[Math.round(Math.min(10, Math.max(0, 5 + r[0])))];
  const hi = ZONE_NUMERALS[Math.round(Math.min(10, Math.max(0, 5 + r[1])))];
  return lo === hi ? lo : `${lo}–${hi}`;
}

/** One decimal with a sign; −0.0 shows as 0.0. */
function signed1(v: number): string {
  const r = Number(v.toFixed(1));
  return r === 0 ? '0.0' : `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(1)}`;
}
interface Cell { text: string; w: number; align?: 'left' | 'right' | 'center'; bold?: boolean; color?: string; size?: number; /** tabular figures (default: right-aligned cells) */ num?: boolean }

/** Draws one look's sheet from the current page on, adding pages as it needs them. */
export function drawSheet(doc: PDFKit.PDFDocument, sheet: ExposureSheet, faces: Faces): void {
  const fonts = faces.inter;
  const REG = faces.reg;
  const BOLD = faces.bold;
  const L = PAGE.margin;
  const W = doc.page.width - 2 * PAGE.margin;
  const bottom = () => doc.page.height - PAGE.margin - 14;
  const t = (s: string) => asciiFractions(s);
  // tabular figures only where numbers line up: Inter's tnum also widens hyphens in words
  const opts = (o: PDFKit.Mixins.TextOptions = {}, num = false): PDFKit.Mixins.TextOptions => ({ features: fonts ? (num ? ['tnum', 'kern'] : ['kern']) : undefined, lineBreak: true, ...o });
  const font = (bold: boolean, size: number, color = C.ink) => doc.font(bold ? BOLD : REG).fontSize(size).fillColor(color);
  const heightOf = (s: string, w: number, bold = false, size = 9, num = false) => font(bold, size).heightOfString(t(s), opts({ width: w }, num));
  let y = PAGE.margin;
  const ensure = (h: number) => {
    if (y + h > bottom()) {
      doc.addPage();
      y = PAGE.margin;
    }
  };
  const heading = (label: string) => {
    ensure(40);
    font(true, 8, C.accent).text(label.toUpperCase(), L, y, opts({ characterSpacing: 0.8, width: W }));
    y += 12;
  };
  const row = (cells: Cell[], x0 = L, pad = 3, fill?: string) => {
    const isNum = (c: Cell) => c.num ?? c.align === 'right';
    const h = Math.max(...cells.map((c) => heightOf(c.text, c.w - 6, c.bold, c.size ?? 9, isNum(c)))) + 2 * pad;
    if (fill) doc.rect(x0, y, cells.reduce((s, c) => s + c.w, 0), h).fill(fill);
    let x = x0;
    for (const c of cells) {
      font(!!c.bold, c.size ?? 9, c.color ?? C.ink).text(t(c.text), x + 3, y + pad, opts({ width: c.w - 6, align: c.align ?? 'left' }, isNum(c)));
      x += c.w;
    }
    doc.moveTo(x0, y + h).lineTo(x, y + h).lineWidth(0.5).strokeColor(C.line).stroke();
    y += h;
    return h;
  };
  const headRow = (cells: Cell[], x0 = L) => row(cells.map((c) => ({ ...c, bold: true, size: 7.5, color: C.mute, num: false })), x0, 2);

  // ---------------------------------------------------------------- header
  font(true, 8, C.accent).text('EXPOSURE SHEET', L, y, opts({ characterSpacing: 1.2 }));
  const stamp = `Grisaille · ${sheet.generatedAt.slice(0, 16).replace('T', ' ')} UTC`;
  font(false, 8, C.mute).text(stamp, L, y, opts({ width: W, align: 'right' }));
  y += 14;
  font(true, 20).text(t(sheet.look.name), L, y, opts({ width: W }));
  y = doc.y + 1;
  font(false, 10, C.soft).text(t(sheet.production.name), L, y, opts({ width: W }));
  y = doc.y + 8;
  doc.moveTo(L, y).lineTo(L + W, y).lineWidth(1).strokeColor(C.ink).stroke();
  y += 12;

  // ---------------------------------------------------------------- light path
  heading('Light path');
  const p = sheet.lightPath;
  const filters = p.filters.length ? p.filters.map((f) => `${f.label}, on the ${f.on}`).join('\n') : 'none';
  const steps = [
    ['Light', p.light], ['Filters', filters], ['Medium', p.medium], ['Development', p.development], ['Print', p.print],
  ];
  const gap = 14;
  const bw = (W - gap * (steps.length - 1)) / steps.length;
  const bh = Math.max(...steps.map(([, v]) => heightOf(v, bw - 12, false, 8.5))) + 24;
  steps.forEach(([k, v], i) => {
    const x = L + i * (bw + gap);
    doc.roundedRect(x, y, bw, bh, 3).lineWidth(0.7).strokeColor(C.line).fillAndStroke(i === 2 ? C.sunk : '#ffffff', C.line);
    font(true, 7, C.mute).text(k.toUpperCase(), x + 6, y + 6, opts({ width: bw - 12, characterSpacing: 0.6 }));
    font(false, 8.5).text(t(v), x + 6, y + 17, opts({ width: bw - 12 }));
    if (i < steps.length - 1) {
      const ax = x + bw + 2;
      const ay = y + bh / 2;
      doc.moveTo(ax, ay).lineTo(ax + gap - 6, ay).lineWidth(1).strokeColor(C.soft).stroke();
      doc.polygon([ax + gap - 4, ay], [ax + gap - 8, ay - 3], [ax + gap - 8, ay + 3]).fill(C.soft);
    }
  });
  y += bh + 12;

  // ---------------------------------------------------------------- factors and EI chain, side by side
  const colW = (W - 20) / 2;
  const top = y;
  heading('Filter factors');
  headRow([{ text: 'Light', w: colW - 130 }, { text: 'Stops', w: 80, align: 'right' }, { text: 'Factor', w: 50, align: 'right' }]);
  for (const f of sheet.factors) {
    row([
      { text: `${f.label}\n${f.light}`, w: colW - 130 },
      { text: f.opaque ? 'opaque' : formatStopsLabel(f.stops), w: 80, align: 'right', color: f.opaque ? C.warn : C.ink },
      { text: formatFactor(f.factor), w: 50, align: 'right' },
    ]);
  }
  font(false, 7.5, C.mute).text('F = sum(E·S) / sum(E·T·S) over 350–900 nm on this medium; stops = log2 F. Open up by this much.', L, y + 4, opts({ width: colW }));
  const leftEnd = doc.y;

  y = top;
  const R = L + colW + 20;
  font(true, 8, C.accent).text('EXPOSURE-INDEX CHAIN', R, y, opts({ characterSpacing: 0.8 }));
  y += 12;
  if (sheet.chain) {
    headRow([{ text: 'Step', w: colW - 130 }, { text: 'Change', w: 70, align: 'right' }, { text: 'EI', w: 60, align: 'right' }], R);
    for (const s of sheet.chain.steps) {
      row([{ text: s.label, w: colW - 130 }, { text: s.step === 'box' ? '' : formatStopsLabel(s.stops), w: 70, align: 'right' }, { text: formatEI(s.ei), w: 60, align: 'right' }], R);
    }
    y += 5;
    doc.rect(R, y, colW, 30).fill(C.ink);
    font(false, 9, '#ffffff').text('Effective EI (this look’s light)', R + 8, y + 10, opts({ width: colW - 80 }));
    font(true, 18, '#ffffff').text(String(sheet.chain.effectiveEI), R + colW - 80, y + 5, opts({ width: 72, align: 'right' }));
    y += 36;
    font(false, 8, C.soft).text(t(`Effective EI under ${sheet.chain.byLight.map((b) => `${b.light}: ${formatEI(b.effectiveEI)}`).join(';  under ')}.`), R, y, opts({ width: colW }, true));
    y = doc.y + 2;
    font(false, 7.5, C.mute).text('Each EI rounded to the ISO third-stop series.', R, y, opts({ width: colW }));
    y = doc.y;
  } else {
    font(false, 9, C.soft).text('The eye has no exposure index.', R, y, opts({ width: colW }));
    y = doc.y;
  }
  y = Math.max(y, leftEnd) + 12;

  // ---------------------------------------------------------------- light levels
  heading('Light levels (incident, at the subject)');
  const cam = sheet.camera;
  const meter = `meter constant C = ${cam.calibrationConstant} lux·s${cam.calibrationConstant === 250 ? ' (flat receptor, the usual value)' : ' (as set for this look)'}`;
  font(false, 8.5, C.soft).text(t(`${cam.fps} fps, ${cam.shutterAngle}° shutter (${formatSeconds(cam.exposureSeconds)})${sheet.chain ? `, ${formatEI(sheet.chain.effectiveEI)}` : ''}. E = C·N² / (t·S) after ISO 2720, ${meter}.`), L, y, opts({ width: W }, true));
  y = doc.y + 4;
  if (sheet.lightLevels.length) {
    const w4 = W / 4;
    headRow([{ text: 'T-stop', w: w4 }, { text: 'Foot-candles', w: w4, align: 'right' }, { text: 'Lux', w: w4, align: 'right' }, { text: 'Unfiltered, fc', w: w4, align: 'right' }]);
    for (const r of sheet.lightLevels) {
      const own = Math.abs(r.tStop - cam.tStop) < 1e-9;
      row([
        { text: formatTStop(r.tStop) + (own ? '  (this look)' : ''), w: w4, bold: own },
        { text: formatFootcandles(r.footcandles), w: w4, align: 'right', bold: own },
        { text: formatLux(r.lux), w: w4, align: 'right', bold: own },
        { text: formatFootcandles(r.unfilteredFootcandles), w: w4, align: 'right', color: C.mute },
      ], L, 2.5, own ? C.sunk : undefined);
    }
  }
  if (sheet.cost) {
    y += 6;
    const text = sheet.cost.ratio > 1.005 ? `This look ${sheet.cost.text} (${formatStopsLabel(sheet.cost.stops)} more light).` : `This look ${sheet.cost.text}.`;
    const h = heightOf(text, W - 16, true, 9.5) + 10;
    doc.rect(L, y, W, h).fill(sheet.cost.ratio > 1.005 ? C.warnSoft : C.sunk);
    font(true, 9.5).text(t(text), L + 8, y + 5, opts({ width: W - 16 }));
    y += h;
  }
  y += 12;
  y = drawSheetLightBudget(doc, sheet, faces, y);

  // ---------------------------------------------------------------- key and zones
  heading('Key and zones');
  const th = sheet.thresholds;
  font(false, 8.5, C.soft).text(t(`Key: ${sheet.key.description}. Texture is lost under ${th.shadowDetailStops.toFixed(1)} stops below the key and blows over ${th.highlightRollOffStops.toFixed(1)} stops above it.${sheet.boards.length ? ` Swatches from: ${sheet.boards.join(', ')}.` : ''}`), L, y, opts({ width: W }));
  y = doc.y + 6;
  ensure(30);
  const zw = W / 11;
  ZONE_NUMERALS.forEach((n, z) => {
    doc.rect(L + z * zw, y, zw, 14).fill(ZONE_GREYS[z]);
    font(true, 7, z < 6 ? '#ffffff' : C.ink).text(n, L + z * zw, y + 4, opts({ width: zw, align: 'center' }));
  });
  doc.rect(L, y, W, 14).lineWidth(0.5).strokeColor(C.line).stroke();
  y += 14;
  const atZone = (zone: number) => L + Math.min(10.98, Math.max(0, zone + 0.5)) * zw;
  for (const s of sheet.swatches) {
    // the plausible range as a bar, the possible range as a fainter line, the estimate as a mark
    const [plLo, plHi] = s.range.plausible.map((v) => atZone(5 + v));
    const [poLo, poHi] = s.range.possible.map((v) => atZone(5 + v));
    if (poHi - poLo > 0.5) doc.rect(poLo, y + 8.5, poHi - poLo, 1).fill(C.line);
    if (plHi - plLo > 0.5) doc.rect(plLo, y + 7.5, plHi - plLo, 3).fill(C.soft);
    const x = atZone(s.zone);
    doc.polygon([x, y + 1], [x - 3, y + 6], [x + 3, y + 6]).fill(s.lost || s.blown ? C.warn : C.ink);
  }
  y += 14;
  if (sheet.swatches.length) {
    const count = (f: SheetFlag) => sheet.swatches.filter((w) => w.flag === f).length;
    const tally = (['lost', 'near-lost', 'blown', 'near-blown'] as const).filter((f) => count(f)).map((f) => `${count(f)} ${SHEET_FLAG_WORDS[f]}`);
    font(true, 8.5).text(t(`${sheet.swatches.length} swatch${sheet.swatches.length === 1 ? '' : 'es'}, every one on the boards${tally.length ? `: ${tally.join(', ')}` : ''}.`), L, y, opts({ width: W }));
    y = doc.y + 4;
    const cols: Cell[] = [
      { text: 'Colour · grey', w: 56 }, { text: 'Swatch', w: W - 56 - 78 - 52 - 40 - 56 - 38 - 100 }, { text: 'Board', w: 78 }, { text: 'Zone', w: 52, align: 'right' },
      { text: 'Stops', w: 40, align: 'right' }, { text: 'Could read', w: 56, align: 'right' }, { text: 'Shift', w: 38, align: 'right' }, { text: 'Note', w: 100 },
    ];
    const header = () => headRow(cols);
    /** a rule across the table where a threshold falls between two rows */
    const divider = (text: string) => {
      if (y + 30 > bottom()) {
        doc.addPage();
        y = PAGE.margin;
        header();
      }
      doc.moveTo(L, y + 1).lineTo(L + W, y + 1).lineWidth(1.2).strokeColor(C.warn).stroke();
      font(true, 7.5, C.warn).text(t(text), L + 3, y + 4, opts({ width: W - 6 }));
      y = doc.y + 3;
    };
    header();
    const rows = sheet.swatches;
    const lastBlown = rows.findLastIndex((w) => !w.key && w.blown);
    const firstLost = rows.findIndex((w) => !w.key && w.lost);
    rows.forEach((s, i) => {
      if (i === firstLost) divider(`Shadow-detail threshold: ${th.shadowDetailStops.toFixed(1)} stops under the key. Texture is lost below this line.`);
      if (y + 16 > bottom()) {
        doc.addPage();
        y = PAGE.margin;
        header();
      }
      const y0 = y;
      const wide = s.range.plausible[1] - s.range.plausible[0] >= 1;
      row(([
        { ...cols[0], text: '' },
        { ...cols[1], text: s.key ? `${s.name} (key)` : s.name, bold: s.key },
        { ...cols[2], text: s.board, color: C.soft },
        { ...cols[3], text: `${s.numeral} (${s.zone.toFixed(1)})` },
        { ...cols[4], text: signed1(s.stops) },
        { ...cols[5], text: rangeWords(s.range.plausible), color: wide ? C.warn : C.soft },
        { ...cols[6], text: signed1(s.shift), color: Math.abs(s.shift) >= 1 ? C.warn : C.ink },
        { ...cols[7], text: [s.flag ? SHEET_FLAG_WORDS[s.flag] : '', wide ? 'measure it' : ''].filter(Boolean).join('; '), color: C.warn, bold: s.flag === 'lost' || s.flag === 'blown' },
      ] as Cell[]).map((c) => ({ ...c, size: 8.5 })), L, 2.5, s.lost || s.blown ? C.warnSoft : undefined);
      const hh = y - y0 - 4;
      doc.rect(L + 3, y0 + 2, 24, hh).fill(s.hex);
      const g = Math.max(0, Math.min(255, s.grey)).toString(16).padStart(2, '0');
      doc.rect(L + 27, y0 + 2, 24, hh).fill(`#${g}${g}${g}`);
      doc.rect(L + 3, y0 + 2, 48, hh).lineWidth(0.4).strokeColor(C.line).stroke();
      if (i === lastBlown) divider(`Highlight roll-off: ${th.highlightRollOffStops.toFixed(1)} stops over the key. Highlights blow above this line.`);
    });
    font(false, 7.5, C.mute).text(t(`Stops from middle grey on the medium with the key placed; shift = medium minus eye (+ reads lighter than it looks). "Could read": the zones a colour given only as a value could land on through this look with a realistic spectrum (bar on the ruler; the faint line is every possible spectrum); measure the swatch to be sure. "Near": within ${NEAR_THRESHOLD_STOPS} stop of a threshold, or could cross it.`), L, y + 3, opts({ width: W }));
    y = doc.y + 10;
  } else {
    font(false, 8.5, C.mute).text(sheet.boardsPicked ? 'The boards picked hold no swatches.' : 'No board shows this look yet: pick boards on the sheet page, or add the look to a board, to list its swatches here.', L, y, opts({ width: W }));
    y = doc.y + 10;
  }

  // ---------------------------------------------------------------- notes
  if (sheet.notes.trim()) {
    heading('Notes');
    font(false, 9).text(t(sheet.notes.trim()), L, y, opts({ width: W }));
    y = doc.y + 10;
  }

  // ---------------------------------------------------------------- cautions
  const items = sheet.cautions.map((c) => ({ ...c, h: heightOf(`${c.title}. ${c.text}`, W - 24, false, 8.5) + 3 }));
  const boxH = 26 + items.reduce((s, i) => s + i.h, 0);
  ensure(boxH + 4);
  doc.rect(L, y, W, boxH).lineWidth(1.2).fillAndStroke(C.warnSoft, C.warn);
  font(true, 9, C.warn).text('CAUTIONS', L + 12, y + 8, opts({ characterSpacing: 0.8 }));
  let cy = y + 21;
  for (const c of items) {
    font(true, 8.5).text(`${c.title}. `, L + 12, cy, opts({ width: W - 24, continued: true })).font(REG).text(t(c.text), opts({ width: W - 24 }));
    cy += c.h;
  }
  y += boxH;
}
