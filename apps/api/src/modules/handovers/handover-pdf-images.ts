import { formatAzimuth, formatDipDirectionDip, SET_COLOURS_LIGHT } from '@roundbook/domain';
import { poleOf, project } from '@roundbook/geomath';
import sharp from 'sharp';
import { StorageNotFoundError, type StorageService } from '../../infrastructure/storage/storage.service.js';
import type { HandoverPictures } from './handover.entity.js';

/** The bytes of a heading's pictures; null where the stored object is missing (the PDF says so). */
export interface LoadedPictures {
  sketch: Buffer | null;
  photos: Array<Buffer | null>;
}

const INK = '#1d2327';
const MUTED = '#4a555c';
const LINE = '#c9d1d6';
/** Poles of joints in no set */
const RANDOM = '#8a949b';
const DRIVE = '#9c4a00';

async function bytesOf(storage: StorageService, key: string | null): Promise<Buffer | null> {
  if (key === null) return null;
  try {
    const o = await storage.get(key);
    const chunks: Buffer[] = [];
    for await (const c of o.body) chunks.push(Buffer.from(c as Uint8Array));
    return Buffer.concat(chunks);
  } catch (e) {
    // Missing: the PDF says so. Storage away (StorageUnavailableError) or anything else: the job retries.
    if (e instanceof StorageNotFoundError) return null;
    throw e;
  }
}

/** Reads a heading's sketch render and photo thumbnails from object storage (for the PDF job). */
export async function loadPictures(
  storage: StorageService,
  pictures: HandoverPictures | undefined,
): Promise<LoadedPictures> {
  if (!pictures) return { sketch: null, photos: [] };
  return {
    sketch: await bytesOf(storage, pictures.sketch?.key ?? null),
    photos: await Promise.all(pictures.photos.map((p) => bytesOf(storage, p.key))),
  };
}

/**
 * A PNG with an alpha channel is decoded by pdfkit in JavaScript and embedded with a soft mask; the sketch's
 * render has one (sharp's SVG output) although it is drawn on paper colour throughout. Flattened onto white
 * by sharp first, it is embedded as it is (several times faster, and the picture looks the same). Bytes
 * sharp cannot read are left as they are.
 */
async function opaquePng(bytes: Buffer): Promise<Buffer> {
  try {
    const meta = await sharp(bytes).metadata();
    if (meta.format !== 'png' || !meta.hasAlpha) return bytes;
    return await sharp(bytes).flatten({ background: '#ffffff' }).png().toBuffer();
  } catch {
    return bytes;
  }
}

/** The pictures as the PDF embeds them (see opaquePng; photo thumbnails are JPEGs, embedded as they are). */
export function opaquePictures(list: LoadedPictures[]): Promise<LoadedPictures[]> {
  return Promise.all(list.map(async (p) => ({ ...p, sketch: p.sketch ? await opaquePng(p.sketch) : null })));
}

/** The colour of a set: the latest round's sets in order, on the sketch's palette; grey for no set. */
const setColour = (sets: string[], label: string | null): string => {
  const i = label ? sets.indexOf(label) : -1;
  return i < 0 ? RANDOM : SET_COLOURS_LIGHT[i % SET_COLOURS_LIGHT.length];
};

/** The stereonet's radius in a column `width` wide. */
const netRadius = (width: number) => Math.min(width / 2 - 14, 88);

/** The legend under the stereonet: its title, then one line per set, the poles in no set and the drive. */
function legendOf(net: NonNullable<HandoverPictures['stereonet']>): { title: string; lines: string[] } {
  const labels = net.sets.map((s) => s.label);
  return {
    title: `Poles of joints, rounds ${net.rounds.join(', ')} — lower hemisphere, equal-area`,
    lines: [
      ...net.sets.map(
        (s) =>
          `${s.label}: mean ${formatDipDirectionDip(s)} (dip direction/dip), ${s.count} joint${s.count === 1 ? '' : 's'}`,
      ),
      ...(net.poles.some((p) => !p.set || !labels.includes(p.set))
        ? ['Not in a set of the latest round']
        : []),
      `Drive ${formatAzimuth(net.driveTrend)} at the face`,
    ],
  };
}

/** The height drawStereonet will use (measured with the same fonts, nothing drawn). */
export function stereonetHeight(
  doc: PDFKit.PDFDocument,
  width: number,
  net: NonNullable<HandoverPictures['stereonet']>,
): number {
  const { title, lines } = legendOf(net);
  let h = 2 * netRadius(width) + 22;
  doc.font('bold').fontSize(8);
  h += doc.heightOfString(title, { width }) + 2;
  doc.font('regular').fontSize(8);
  for (const l of lines) h += doc.heightOfString(l, { width: width - 16 }) + 1;
  return h;
}

/**
 * A lower-hemisphere equal-area stereonet drawn as vectors (geomath project): the primitive with ticks every
 * 10° and N, the poles of the recent rounds' joints coloured by set, each set's mean pole as a ringed
 * square with its label, and the drive direction at the face as an arrow to the primitive; the legend
 * beneath. Returns the height used.
 */
export function drawStereonet(
  doc: PDFKit.PDFDocument,
  x: number,
  y: number,
  width: number,
  net: NonNullable<HandoverPictures['stereonet']>,
): number {
  const r = netRadius(width);
  const cx = x + width / 2;
  const cy = y + r + 14;
  const at = (trend: number, plunge: number) => {
    const p = project({ trend, plunge }, 'equal-area', r);
    return { x: cx + p.x, y: cy - p.y };
  };
  doc.save();
  doc.circle(cx, cy, r).fillColor('#ffffff').fill();
  for (let a = 0; a < 360; a += 10) {
    const len = a % 90 === 0 ? 6 : 3;
    const s = Math.sin((a * Math.PI) / 180);
    const c = Math.cos((a * Math.PI) / 180);
    doc
      .moveTo(cx + r * s, cy - r * c)
      .lineTo(cx + (r - len) * s, cy - (r - len) * c)
      .strokeColor(INK)
      .lineWidth(0.6)
      .stroke();
  }
  doc
    .moveTo(cx - 4, cy)
    .lineTo(cx + 4, cy)
    .moveTo(cx, cy - 4)
    .lineTo(cx, cy + 4)
    .strokeColor(MUTED)
    .lineWidth(0.5)
    .stroke();
  doc.circle(cx, cy, r).strokeColor(INK).lineWidth(1).stroke();
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(INK)
    .text('N', cx - 4, cy - r - 14, { width: 8, align: 'center', lineBreak: false });

  // The drive: a horizontal line at the drive's trend, from the centre to the primitive.
  const tip = at(net.driveTrend, 0);
  const ang = Math.atan2(tip.y - cy, tip.x - cx);
  const head = (d: number) => ({ x: tip.x - 9 * Math.cos(ang + d), y: tip.y - 9 * Math.sin(ang + d) });
  doc.moveTo(cx, cy).lineTo(tip.x, tip.y).strokeColor(DRIVE).lineWidth(1.6).stroke();
  const h1 = head(0.4);
  const h2 = head(-0.4);
  doc.polygon([tip.x, tip.y], [h1.x, h1.y], [h2.x, h2.y]).fillColor(DRIVE).fill();

  // Each set's mean pole as a hollow square, under the poles: a pole at or next to a mean stays in view.
  const labels = net.sets.map((s) => s.label);
  for (const s of net.sets) {
    const l = poleOf({ dipDirection: s.dipDirection, dip: s.dip });
    const q = at(l.trend, l.plunge);
    const colour = setColour(labels, s.label);
    doc
      .rect(q.x - 4.5, q.y - 4.5, 9, 9)
      .strokeColor(colour)
      .lineWidth(1.5)
      .stroke();
    doc
      .font('bold')
      .fontSize(8)
      .fillColor(colour)
      .text(s.label, q.x + 7, q.y - 5, { lineBreak: false });
  }
  for (const p of net.poles) {
    const l = poleOf({ dipDirection: p.dipDirection, dip: p.dip });
    const q = at(l.trend, l.plunge);
    doc.circle(q.x, q.y, 2.2).fillColor(setColour(labels, p.set)).fill();
  }
  doc.restore();

  // Legend
  let ly = cy + r + 8;
  const item = (draw: (mx: number, my: number) => void, text: string) => {
    draw(x + 6, ly + 5);
    doc
      .font('regular')
      .fontSize(8)
      .fillColor(INK)
      .text(text, x + 16, ly, { width: width - 16 });
    ly = doc.y + 1;
  };
  const legend = legendOf(net);
  doc.font('bold').fontSize(8).fillColor(INK).text(legend.title, x, ly, { width });
  ly = doc.y + 2;
  for (const s of net.sets) {
    const colour = setColour(labels, s.label);
    item((mx, my) => {
      doc
        .rect(mx - 3.5, my - 3.5, 7, 7)
        .strokeColor(colour)
        .lineWidth(1.5)
        .stroke();
    }, legend.lines[net.sets.indexOf(s)]);
  }
  if (legend.lines.length > net.sets.length + 1)
    item((mx, my) => void doc.circle(mx, my, 2.2).fillColor(RANDOM).fill(), legend.lines[net.sets.length]);
  item(
    (mx, my) =>
      void doc
        .moveTo(mx - 4, my)
        .lineTo(mx + 4, my)
        .strokeColor(DRIVE)
        .lineWidth(1.6)
        .stroke(),
    legend.lines[legend.lines.length - 1],
  );
  return ly - y;
}

/**
 * A heading's pictures: the sketch and the stereonet side by side, then up to six photo thumbnails three to a
 * row with their captions. Anything missing is a line saying so, never a failed PDF.
 */
export function drawPictures(
  doc: PDFKit.PDFDocument,
  pictures: HandoverPictures | undefined,
  loaded: LoadedPictures,
  left: number,
  width: number,
): void {
  if (!pictures) return;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const note = (t: string, x: number, y: number, w: number) =>
    doc.font('regular').fontSize(9).fillColor(MUTED).text(t, x, y, { width: w });

  const half = (width - 16) / 2;
  const SKETCH_BOX = 220;
  // The sketch and the stereonet side by side, moved whole to a new page when the pair does not fit here.
  const pair =
    4 +
    16 +
    Math.max(
      loaded.sketch ? SKETCH_BOX : 40,
      pictures.stereonet ? stereonetHeight(doc, half, pictures.stereonet) : 40,
    );
  if (doc.y + pair > bottom()) doc.addPage();
  const top = doc.y + 4;
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(INK)
    .text(pictures.sketch ? `Sketch of round ${pictures.sketch.roundNumber}` : 'Sketch', left, top, {
      width: half,
    });
  doc.font('bold').text('Stereonet', left + half + 16, top, { width: half });
  const body = top + 16;
  let sketchBottom: number;
  if (loaded.sketch) {
    const h = SKETCH_BOX;
    doc.rect(left, body, half, h).strokeColor(LINE).lineWidth(0.5).stroke();
    doc.image(loaded.sketch, left + 2, body + 2, {
      fit: [half - 4, h - 4],
      align: 'center',
      valign: 'center',
    });
    sketchBottom = body + h;
  } else {
    note(
      pictures.sketch
        ? `The picture of round ${pictures.sketch.roundNumber}'s sketch is not in storage (not rendered yet or removed).`
        : pictures.sketchRound !== null
          ? `Round ${pictures.sketchRound} was handed in without a sketch.`
          : 'No round handed in yet.',
      left,
      body,
      half,
    );
    sketchBottom = doc.y;
  }
  let netBottom: number;
  if (pictures.stereonet)
    netBottom = body + drawStereonet(doc, left + half + 16, body, half, pictures.stereonet);
  else {
    note('No joint orientations recorded on the recent rounds.', left + half + 16, body, half);
    netBottom = doc.y;
  }
  doc.x = left;
  doc.y = Math.max(sketchBottom, netBottom) + 10;

  const gap = 10;
  const w = (width - 2 * gap) / 3;
  const h = w * 0.72;
  /** A row of thumbnails with their captions (two lines at most) and the space under it */
  const rowHeight = 4 + h + 2 + 22 + 6;
  // The title stays with the first row; each row is moved whole to the next page when it does not fit.
  if (doc.y + 16 + (pictures.photos.length ? rowHeight : 14) > bottom()) doc.addPage();
  doc.font('bold').fontSize(10).fillColor(INK).text('Photos', left, doc.y, { width });
  if (pictures.photos.length === 0) {
    note('No photos on the recent rounds.', left, doc.y, width);
    return;
  }
  for (let row = 0; row * 3 < pictures.photos.length; row++) {
    if (doc.y + rowHeight > bottom()) doc.addPage();
    const y = doc.y + 4;
    let rowBottom = y;
    for (let col = 0; col < 3; col++) {
      const i = row * 3 + col;
      const p = pictures.photos[i];
      if (!p) break;
      const x = left + col * (w + gap);
      const bytes = loaded.photos[i];
      if (bytes) {
        doc.rect(x, y, w, h).fillColor('#f3f5f6').fill();
        doc.image(bytes, x, y, { fit: [w, h], align: 'center', valign: 'center' });
      } else {
        doc.rect(x, y, w, h).strokeColor(LINE).lineWidth(0.5).stroke();
        note(p.key ? 'Thumbnail not in storage.' : 'Thumbnail not made yet.', x + 6, y + h / 2 - 6, w - 12);
      }
      doc
        .font('regular')
        .fontSize(8)
        .fillColor(INK)
        .text(`Round ${p.roundNumber}${p.caption ? `: ${p.caption}` : ''}`, x, y + h + 2, {
          width: w,
          height: 22,
          ellipsis: true,
        });
      rowBottom = Math.max(rowBottom, doc.y);
    }
    doc.x = left;
    doc.y = rowBottom + 6;
  }
}
