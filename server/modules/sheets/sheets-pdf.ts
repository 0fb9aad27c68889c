/**
 * The exposure sheet as a PDF file (pdfkit): one look's sheet, or the sheets of the day's looks one after
 * another, each starting on a new page, with a footer naming the look on every page.
 */
import PDFDocument from 'pdfkit';
import type { ExposureSheet } from '../../../shared/schemas/sheet';
import { asciiFractions } from '../../../shared/tone/exposure-format';
import { drawSheet } from './sheet-pdf';
import { C, PAGE, interFiles, type Faces } from './sheet-pdf-style';

/** Renders one look's sheet; resolves with the PDF bytes. */
export function renderSheetPdf(sheet: ExposureSheet): Promise<Buffer> {
  return renderSheetsPdf([sheet]);
}

/**
 * Renders the sheets of several looks (the day's) one after another in one PDF, each starting on a new page;
 * every page's footer names its look and counts the pages of the file.
 */
export function renderSheetsPdf(sheets: readonly ExposureSheet[]): Promise<Buffer> {
  const one = sheets.length === 1;
  const title = one ? `Exposure sheet: ${sheets[0].look.name}` : `Exposure sheets: ${sheets.map((x) => x.look.name).join(', ')}`;
  const doc = new PDFDocument({ size: PAGE.size, margin: PAGE.margin, bufferPages: true, info: { Title: title, Subject: sheets[0]?.production.name ?? '', Creator: 'Grisaille' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const files = interFiles();
  const faces: Faces = files ? { reg: 'Inter', bold: 'Inter-SemiBold', inter: true } : { reg: 'Helvetica', bold: 'Helvetica-Bold', inter: false };
  if (files) {
    doc.registerFont(faces.reg, files.regular);
    doc.registerFont(faces.bold, files.semibold);
  }
  /** the first page (0-based) of each sheet */
  const firstPages: number[] = [];
  sheets.forEach((sheet, i) => {
    if (i > 0) doc.addPage();
    firstPages.push(doc.bufferedPageRange().count - 1);
    drawSheet(doc, sheet, faces);
  });

  // ---------------------------------------------------------------- footers
  const L = PAGE.margin;
  const W = doc.page.width - 2 * PAGE.margin;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    let k = 0;
    while (k + 1 < firstPages.length && firstPages[k + 1] <= i) k++;
    const sheet = sheets[k];
    doc.switchToPage(i);
    doc.page.margins.bottom = 0; // the footer sits in the margin; without this pdfkit would start a new page
    const fy = doc.page.height - PAGE.margin - 8;
    const which = one ? '' : `Sheet ${k + 1} of ${sheets.length} · `;
    doc.font(faces.reg).fontSize(7).fillColor(C.mute);
    doc.text(asciiFractions(`${which}${sheet.production.name} · ${sheet.look.name} · model values: confirm with a meter and camera tests.`), L, fy, { width: W - 60, lineBreak: false });
    doc.text(`Page ${i + 1} of ${range.count}`, L + W - 60, fy, { width: 60, align: 'right', lineBreak: false });
  }
  doc.end();
  return done;
}
