import { openSync, type Font } from 'fontkit';
import PDFDocument from 'pdfkit';
import { drawPictures, opaquePictures, type LoadedPictures } from './handover-pdf-images.js';
import {
  HANDOVER_CAUTION,
  handoverHeader,
  handoverSubject,
  headingFacts,
  LOOK_AHEAD_COLUMNS,
  type LookAheadRow,
} from './handover-text.js';
import type { HandoverSnapshot } from './handover.entity.js';
import { glyphCheckOf, pdfSafeText } from './pdf-safe-text.js';

/** Open Sans (TTF from @expo-google-fonts/open-sans; pdfkit fails on WOFF2, stack-notes §9). */
const FONT_REGULAR = require.resolve('@expo-google-fonts/open-sans/400Regular/OpenSans_400Regular.ttf');
const FONT_BOLD = require.resolve('@expo-google-fonts/open-sans/700Bold/OpenSans_700Bold.ttf');
/**
 * Both weights parsed once per process: pdfkit takes a fontkit font as a font source and makes each
 * document's subset from it, so a PDF does not parse the TTF files again (about a tenth of its time).
 */
let parsed: { regular: Font; bold: Font } | null = null;
const fonts = () => (parsed ??= { regular: openSync(FONT_REGULAR), bold: openSync(FONT_BOLD) });
/** Whether both weights can draw a character (read from the fonts' own glyph tables, once). */
let drawable: ((codePoint: number) => boolean) | null = null;
const safe = (t: string): string => pdfSafeText(t, (drawable ??= glyphCheckOf(FONT_REGULAR, FONT_BOLD)));

/**
 * Every string this document lays out goes through pdfSafeText first: a character Open Sans has no glyph
 * for (the → of a trigger summary) would otherwise print blank with no error.
 */
function withSafeText(doc: PDFKit.PDFDocument): PDFKit.PDFDocument {
  const text = doc.text.bind(doc) as (t: string, ...rest: unknown[]) => PDFKit.PDFDocument;
  const height = doc.heightOfString.bind(doc) as (t: string, ...rest: unknown[]) => number;
  const width = doc.widthOfString.bind(doc) as (t: string, ...rest: unknown[]) => number;
  doc.text = (t: string, ...rest: unknown[]) => text(safe(t), ...rest);
  doc.heightOfString = (t: string, ...rest: unknown[]) => height(safe(t), ...rest);
  doc.widthOfString = (t: string, ...rest: unknown[]) => width(safe(t), ...rest);
  return doc;
}

const INK = '#1d2327';
const MUTED = '#4a555c';
const LINE = '#c9d1d6';
const CAUTION = '#b26a00';

export interface HandoverPdfInput {
  snapshot: HandoverSnapshot;
  shiftDate: string;
  shift: 'day' | 'night';
  sentAt: Date;
  /** Each heading's pictures as read from storage, in the snapshot's order (absent: none drawn) */
  pictures?: LoadedPictures[];
}

/** Column widths of the look-ahead table, as shares of the text width. */
const LOOK_AHEAD_SHARES: Record<keyof LookAheadRow, number> = {
  feature: 0.3,
  crown: 0.16,
  invert: 0.16,
  ahead: 0.18,
  round: 0.2,
};

/** The look-ahead as a table with a shaded header row; rows never split across a page. */
function lookAheadTable(doc: PDFKit.PDFDocument, rows: LookAheadRow[], left: number, width: number): void {
  const pad = 4;
  const widths = LOOK_AHEAD_COLUMNS.map(([k]) => LOOK_AHEAD_SHARES[k] * width);
  const drawRow = (cells: string[], header: boolean, shade: string | null) => {
    doc.font(header ? 'bold' : 'regular').fontSize(9);
    const height =
      Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: widths[i] - 2 * pad }))) + 2 * pad;
    if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
    const top = doc.y;
    if (shade) doc.rect(left, top, width, height).fillColor(shade).fill();
    let x = left;
    cells.forEach((c, i) => {
      doc
        .fillColor(INK)
        .font(header ? 'bold' : 'regular')
        .fontSize(9)
        .text(c, x + pad, top + pad, { width: widths[i] - 2 * pad });
      x += widths[i];
    });
    doc
      .moveTo(left, top + height)
      .lineTo(left + width, top + height)
      .strokeColor(LINE)
      .lineWidth(0.5)
      .stroke();
    doc.x = left;
    doc.y = top + height;
  };
  doc.y += 2;
  drawRow(
    LOOK_AHEAD_COLUMNS.map(([, title]) => title),
    true,
    '#e8eef1',
  );
  rows.forEach((r, i) =>
    drawRow(
      LOOK_AHEAD_COLUMNS.map(([k]) => r[k]),
      false,
      i % 2 === 1 ? '#f6f8f9' : null,
    ),
  );
}

/**
 * The handover as an A4 PDF: who to whom, then per heading its face, cycle, last confirmed round, class,
 * next round length, alerts, open hazards and notes, the general notes and the caution (on every page's foot as well).
 */
export async function renderHandoverPdf(input: HandoverPdfInput): Promise<Buffer> {
  const s = input.snapshot;
  const pictures = input.pictures ? await opaquePictures(input.pictures) : undefined;
  const doc = withSafeText(
    new PDFDocument({
      size: 'A4',
      margins: { top: 50, bottom: 70, left: 50, right: 50 },
      bufferPages: true,
      info: {
        Title: handoverSubject(s, input.shiftDate, input.shift),
        Author: s.outgoing.name,
        Creator: 'Roundbook',
      },
    }),
  );
  // The typings list paths and bytes only; pdfkit 0.20 also takes a font object (anything with layout()).
  doc.registerFont('regular', fonts().regular as unknown as string);
  doc.registerFont('bold', fonts().bold as unknown as string);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 100;
  const left = 50;

  const fact = (label: string, value: string) => {
    const y = doc.y;
    doc.font('regular').fontSize(10).fillColor(MUTED).text(label, left, y, { width: 170 });
    const labelBottom = doc.y;
    doc
      .font('bold')
      .fontSize(10)
      .fillColor(INK)
      .text(value, left + 175, y, { width: width - 175 });
    doc.y = Math.max(doc.y, labelBottom) + 2;
  };

  const bottom = () => doc.page.height - doc.page.margins.bottom;
  /** Starts a new page unless `height` more points fit above the foot of this one. */
  const keepWith = (height: number) => {
    if (doc.y + height > bottom()) doc.addPage();
  };
  /**
   * A titled list of bullets: the title stays with the first item, and no item is split across pages (a
   * hazard's level, range and description read together).
   */
  const list = (title: string, items: string[], empty: string) => {
    const lines = items.length ? items.map((i) => `• ${i}`) : [empty];
    doc.font('regular').fontSize(10);
    const heightOf = (t: string) => doc.heightOfString(t, { width: width - 10 });
    doc.font('bold');
    keepWith(doc.heightOfString(title, { width }) + heightOf(lines[0]));
    doc.fillColor(INK).text(title, left, doc.y, { width });
    doc.font('regular').fontSize(10);
    for (const [i, line] of lines.entries()) {
      if (i > 0) keepWith(heightOf(line));
      if (items.length) doc.text(line, left + 10, doc.y, { width: width - 10 });
      else doc.text(line, left, doc.y, { width });
    }
  };

  doc.font('bold').fontSize(18).fillColor(INK).text('Shift handover', left, doc.y, { width });
  doc.font('regular').fontSize(11).fillColor(MUTED).text(s.projectName, { width });
  doc.moveDown(0.6);
  for (const [k, v] of handoverHeader(s, input.shiftDate, input.shift, input.sentAt)) fact(k, v);
  doc.moveDown(0.6);

  for (const [index, h] of s.headings.map(headingFacts).entries()) {
    if (doc.y > doc.page.height - 240) doc.addPage();
    doc
      .moveTo(left, doc.y)
      .lineTo(left + width, doc.y)
      .strokeColor(LINE)
      .lineWidth(1)
      .stroke();
    doc.moveDown(0.4);
    doc.font('bold').fontSize(14).fillColor(INK).text(h.title, left, doc.y, { width });
    doc.moveDown(0.3);
    for (const [k, v] of h.facts) fact(k, v);
    doc.moveDown(0.3);
    list('Alerts', h.alerts, 'None');
    doc.moveDown(0.3);
    list('Open hazards', h.hazards, 'None');
    doc.moveDown(0.3);
    list('Support outstanding', h.supportOutstanding, 'None recorded');
    doc.moveDown(0.3);
    keepWith(doc.heightOfString('Look-ahead', { width }) + 44); // the title, the header row and a row
    doc.font('bold').fontSize(10).fillColor(INK).text('Look-ahead', left, doc.y, { width });
    if (h.lookAheadRows.length === 0)
      doc
        .font('regular')
        .text('No mapped fault or shear zone reaches the crown or invert ahead of the face.', { width });
    else {
      lookAheadTable(doc, h.lookAheadRows, left, width);
      doc
        .font('regular')
        .fontSize(8.5)
        .fillColor(MUTED)
        .text(h.lookAheadBasis, left, doc.y + 2, { width });
    }
    if (h.notes) {
      doc.moveDown(0.3);
      doc.font('bold').fontSize(10).text('Notes', left, doc.y, { width });
      doc.font('regular').fontSize(10).text(h.notes, { width });
    }
    const loaded = pictures?.[index];
    if (loaded) drawPictures(doc, s.headings[index].pictures, loaded, left, width);
    doc.moveDown(0.8);
  }

  if (s.generalNotes) {
    doc.font('bold').fontSize(12).fillColor(INK).text('General notes', left, doc.y, { width });
    doc.font('regular').fontSize(10).text(s.generalNotes, { width });
    doc.moveDown(0.8);
  }

  // The caution in a box after the content (a new page only when the box does not fit), and in small type
  // at every page's foot.
  doc.font('bold').fontSize(10).fillColor(INK);
  const textHeight = doc.heightOfString(HANDOVER_CAUTION, { width: width - 24 });
  keepWith(textHeight + 16);
  const boxTop = doc.y;
  doc
    .rect(left, boxTop, width, textHeight + 16)
    .fillColor('#fff6e5')
    .fill();
  doc
    .rect(left, boxTop, 4, textHeight + 16)
    .fillColor(CAUTION)
    .fill();
  doc.fillColor(INK).text(HANDOVER_CAUTION, left + 14, boxTop + 8, { width: width - 24 });

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('regular')
      .fontSize(7.5)
      .fillColor(MUTED)
      .text(`${HANDOVER_CAUTION}  Page ${i + 1} of ${range.count}.`, left, doc.page.height - 52, {
        width,
        lineBreak: true,
      });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return await done;
}
