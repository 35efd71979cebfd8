import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { LASER_CAUTIONS } from '#shared/safety.ts';
import { nunitoWoff } from '#server/lib/fonts.ts';

/**
 * The job sheet: one printed page that goes with the piece from the machine to the parcel. It
 * says what to burn with which settings, how long it should take, what to check, the cautions,
 * and carries a QR code that opens the order in the workspace. Drawn with PDFKit in Nunito (the
 * app's own font, from @fontsource/nunito).
 */
export type JobSheet = {
  studioName: string;
  title: string;
  subtitle: string;
  orderUrl: string;
  /** A small PNG of the engrave file, as it will burn. */
  preview: Buffer;
  /** Label and value rows, in the order printed; sections start with a row whose value is null. */
  rows: Array<[string, string | null]>;
  checks: string[];
  paper: 'A4' | 'LETTER';
};

const FONT = { regular: nunitoWoff(400), bold: nunitoWoff(800) };
const INK = '#2b2622';
const MUTED = '#6b625a';

export async function jobSheetPdf(sheet: JobSheet): Promise<Buffer> {
  const qr = await QRCode.toBuffer(sheet.orderUrl, { type: 'png', errorCorrectionLevel: 'M', margin: 1, scale: 6 });
  const doc = new PDFDocument({
    size: sheet.paper,
    margin: 40,
    info: { Title: sheet.title, Author: sheet.studioName, Creator: 'Etchwell' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('regular', FONT.regular);
  doc.registerFont('bold', FONT.bold);
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  // Header: who, what, and the code that opens the order.
  doc.font('regular').fontSize(10).fillColor(MUTED).text(sheet.studioName, left, 40);
  doc
    .font('bold')
    .fontSize(22)
    .fillColor(INK)
    .text(sheet.title, left, 54, { width: width - 110 });
  doc
    .font('regular')
    .fontSize(11)
    .fillColor(MUTED)
    .text(sheet.subtitle, { width: width - 110 });
  doc.image(qr, left + width - 96, 36, { fit: [96, 96] });
  doc.fontSize(7).text('Scan to open the order', left + width - 100, 134, { width: 104, align: 'center' });

  // The preview beside the facts.
  const top = 160;
  // Framed at its own proportions (a PNG's IHDR holds width and height at bytes 16 and 20).
  const [pw, ph] = [sheet.preview.readUInt32BE(16), sheet.preview.readUInt32BE(20)];
  const scale = Math.min(170 / pw, 220 / ph);
  doc.image(sheet.preview, left, top, { width: pw * scale, height: ph * scale });
  doc
    .rect(left, top, pw * scale, ph * scale)
    .lineWidth(0.5)
    .strokeColor('#cfc6bb')
    .stroke();
  doc
    .font('regular')
    .fontSize(7)
    .fillColor(MUTED)
    .text('The engrave file as sent to the machine: black dots fire the laser.', left, top + ph * scale + 4, { width: 170 });
  const labelX = left + 190;
  const valueX = labelX + 120;
  const valueWidth = left + width - valueX;
  // The facts are set at the largest size that leaves room below for the checks and the
  // cautions, so the sheet is always one page, whatever the recipe notes say.
  const below = measureBelow(doc, sheet.checks, width);
  const bottom = doc.page.height - doc.page.margins.bottom;
  const size = [9.5, 8.5, 7.5].find((s) => Math.max(top + rowsHeight(doc, sheet.rows, s, valueWidth), top + 230) + below <= bottom) ?? 7.5;
  let y = top;
  const line = size + 3.5;
  for (const [label, value] of sheet.rows) {
    if (value === null) {
      y += y === top ? 0 : 6;
      doc
        .font('bold')
        .fontSize(size + 0.5)
        .fillColor(INK)
        .text(label.toUpperCase(), labelX, y, { characterSpacing: 0.6 });
      y = doc.y + 2;
      continue;
    }
    doc.font('regular').fontSize(size).fillColor(MUTED).text(label, labelX, y, { width: 115 });
    // At most three lines a value (long recipe notes end in "…").
    doc
      .font('bold')
      .fontSize(size)
      .fillColor(INK)
      .text(value, valueX, y, { width: valueWidth, height: 3 * line, ellipsis: true });
    y = Math.max(doc.y, y + line) + 1;
  }

  // Checks to tick by hand.
  y = Math.max(y, top + 230) + 14;
  doc.font('bold').fontSize(10).fillColor(INK).text('CHECKS', left, y, { characterSpacing: 0.6 });
  y = doc.y + 4;
  for (const check of sheet.checks) {
    doc
      .rect(left, y + 1, 9, 9)
      .lineWidth(0.8)
      .strokeColor(INK)
      .stroke();
    doc
      .font('regular')
      .fontSize(10)
      .fillColor(INK)
      .text(check, left + 16, y, { width: width - 16 });
    y = doc.y + 4;
  }

  // The cautions, boxed.
  y += 10;
  const boxTop = y;
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(INK)
    .text('Before you burn', left + 12, y + 10);
  doc.font('regular').fontSize(9);
  for (const caution of LASER_CAUTIONS) doc.text(`•  ${caution}`, left + 12, doc.y + 3, { width: width - 24 });
  doc
    .rect(left, boxTop, width, doc.y - boxTop + 10)
    .lineWidth(1.2)
    .strokeColor('#b7791f')
    .stroke();

  doc.end();
  return finished;
}

/** The height the facts take at a font size, as drawn above (section heads, three-line values). */
function rowsHeight(doc: PDFKit.PDFDocument, rows: JobSheet['rows'], size: number, valueWidth: number): number {
  const line = size + 3.5;
  let height = 0;
  for (const [label, value] of rows) {
    if (value === null) {
      height +=
        (height === 0 ? 0 : 6) +
        doc
          .font('bold')
          .fontSize(size + 0.5)
          .heightOfString(label.toUpperCase()) +
        2;
      continue;
    }
    const valueHeight = Math.min(3 * line, doc.font('bold').fontSize(size).heightOfString(value, { width: valueWidth }));
    height += Math.max(valueHeight, line) + 1;
  }
  return height;
}

/** The height of the checks and the cautions' box, with their gaps. */
function measureBelow(doc: PDFKit.PDFDocument, checks: string[], width: number): number {
  let height = 14 + doc.font('bold').fontSize(10).heightOfString('CHECKS') + 4;
  for (const check of checks)
    height +=
      doc
        .font('regular')
        .fontSize(10)
        .heightOfString(check, { width: width - 16 }) + 4;
  height += 10 + 10 + doc.font('bold').fontSize(10).heightOfString('Before you burn');
  for (const caution of LASER_CAUTIONS)
    height +=
      3 +
      doc
        .font('regular')
        .fontSize(9)
        .heightOfString(`•  ${caution}`, { width: width - 24 });
  return height + 10;
}
