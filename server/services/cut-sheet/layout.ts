// Page set-up of the cut sheet: paper, the embedded Chinese font (subset by pdfkit), bilingual
// text blocks, page breaks, and the footer and "not for cutting" stamp put on every page at the end.
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import { pageOf, L, type Bilingual } from './labels';

export const papers = ['a4', 'letter'] as const;
export type Paper = (typeof papers)[number];

const require_ = createRequire(__filename);
let fonts: { regular: Buffer; bold: Buffer } | null = null;
/** Noto Sans SC carries Latin and Chinese: one family for the whole sheet, read once. */
function fontFiles() {
  if (!fonts) {
    const dir = require_.resolve('@expo-google-fonts/noto-sans-sc/package.json').replace(/package\.json$/, '');
    fonts = {
      regular: readFileSync(`${dir}400Regular/NotoSansSC_400Regular.ttf`),
      bold: readFileSync(`${dir}700Bold/NotoSansSC_700Bold.ttf`),
    };
  }
  return fonts;
}

export const MARGIN = 42;
const FOOTER_SPACE = 30;
export const INK = '#111111';
export const MUTED = '#555555';
export const RULE = '#BBBBBB';
export const MARK = '#C0262D';

export type Doc = PDFKit.PDFDocument;

export function newDocument(paper: Paper, info: { title: string; subject: string }): Doc {
  const doc = new PDFDocument({
    size: paper === 'letter' ? 'LETTER' : 'A4',
    margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER_SPACE },
    bufferPages: true,
    autoFirstPage: true,
    info: { Title: info.title, Subject: info.subject, Creator: 'Toolgate', Producer: 'Toolgate' },
    lang: 'en',
  });
  const f = fontFiles();
  doc.registerFont('body', f.regular);
  doc.registerFont('bold', f.bold);
  doc.font('body').fontSize(9).fillColor(INK);
  return doc;
}

export const contentWidth = (doc: Doc) => doc.page.width - doc.page.margins.left - doc.page.margins.right;
const bottomLimit = (doc: Doc) => doc.page.height - doc.page.margins.bottom;

/** Starts a new page unless `height` points still fit on this one. */
export function ensureSpace(doc: Doc, height: number) {
  if (doc.y + height > bottomLimit(doc)) doc.addPage();
}

/** A section heading: English, Chinese beside it, a rule beneath. */
export function heading(doc: Doc, label: Bilingual) {
  ensureSpace(doc, 60);
  doc.moveDown(0.6);
  const x = doc.page.margins.left;
  doc.font('bold').fontSize(12).fillColor(INK).text(`${label.en}  ${label.zh}`, x, doc.y, { width: contentWidth(doc) });
  const y = doc.y + 2;
  doc.moveTo(x, y).lineTo(x + contentWidth(doc), y).lineWidth(0.6).strokeColor(RULE).stroke();
  doc.y = y + 5;
  doc.font('body').fontSize(9).fillColor(INK);
}

/** A label (English over Chinese, small) in the left column and its value on the right. */
export function field(doc: Doc, label: Bilingual, value: string, opts: { x?: number; width?: number; labelWidth?: number; bold?: boolean } = {}) {
  const x = opts.x ?? doc.page.margins.left;
  const width = opts.width ?? contentWidth(doc);
  const lw = opts.labelWidth ?? 170;
  doc.font('body').fontSize(9);
  // One line when it fits (English, then Chinese); it wraps beneath when it does not.
  const labelText = `${label.en}  ${label.zh}`;
  const valueHeight = doc.font(opts.bold ? 'bold' : 'body').fontSize(9.5).heightOfString(value || '–', { width: width - lw - 6 });
  const labelHeight = doc.font('body').fontSize(7.5).heightOfString(labelText, { width: lw });
  const h = Math.max(valueHeight, labelHeight);
  ensureSpace(doc, h + 3);
  const y = doc.y;
  doc.font('body').fontSize(7.5).fillColor(MUTED).text(labelText, x, y, { width: lw });
  doc.font(opts.bold ? 'bold' : 'body').fontSize(9.5).fillColor(INK).text(value || '–', x + lw + 6, y, { width: width - lw - 6 });
  doc.y = y + h + 3;
  doc.x = doc.page.margins.left;
}

/** A paragraph in both languages: English, then Chinese (lighter) beneath. */
export function bilingualParagraph(doc: Doc, text: Bilingual, size = 9) {
  const width = contentWidth(doc);
  const h = doc.font('body').fontSize(size).heightOfString(text.en, { width }) + doc.heightOfString(text.zh, { width });
  ensureSpace(doc, Math.min(h, 200));
  doc.font('body').fontSize(size).fillColor(INK).text(text.en, doc.page.margins.left, doc.y, { width });
  doc.fillColor(MUTED).text(text.zh, { width });
  doc.fillColor(INK).moveDown(0.3);
}

export function paragraph(doc: Doc, text: string, opts: { size?: number; bold?: boolean; color?: string; indent?: number } = {}) {
  const indent = opts.indent ?? 0;
  doc
    .font(opts.bold ? 'bold' : 'body')
    .fontSize(opts.size ?? 9)
    .fillColor(opts.color ?? INK)
    .text(text, doc.page.margins.left + indent, doc.y, { width: contentWidth(doc) - indent });
  doc.font('body').fillColor(INK);
}

/**
 * Every page: the footer (request number, short content hash, page n of N) and, when the request is
 * not cleared to cut, the diagonal stamp. Run once all content is on the pages.
 */
export function finishPages(doc: Doc, footer: { ref: string; contentHash: string }, stamped: boolean) {
  const range = doc.bufferedPageRange();
  const total = range.count;
  for (let i = range.start; i < range.start + total; i++) {
    doc.switchToPage(i);
    const { width, height } = doc.page;
    // Writing below the bottom margin must not start a new page.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const y = height - MARGIN - 12;
    doc.moveTo(MARGIN, y - 4).lineTo(width - MARGIN, y - 4).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.font('body').fontSize(7.5).fillColor(MUTED);
    doc.text(`${L.sheet.en} ${L.sheet.zh} · ${footer.ref}`, MARGIN, y, { width: (width - 2 * MARGIN) / 3, lineBreak: false });
    doc.text(`${L.contentHash.en} ${L.contentHash.zh} ${footer.contentHash.slice(0, 12)}`, MARGIN + (width - 2 * MARGIN) / 3, y, {
      width: (width - 2 * MARGIN) / 3,
      align: 'center',
      lineBreak: false,
    });
    doc.text(pageOf(i - range.start + 1, total), MARGIN + (2 * (width - 2 * MARGIN)) / 3, y, { width: (width - 2 * MARGIN) / 3, align: 'right', lineBreak: false });
    if (stamped) stamp(doc);
    doc.page.margins.bottom = bottom;
  }
}

function stamp(doc: Doc) {
  const { width, height } = doc.page;
  doc.save();
  doc.rotate(-35, { origin: [width / 2, height / 2] });
  doc.fillColor(MARK).fillOpacity(0.22).font('bold').fontSize(52);
  const text = `${L.stamp.en}\n${L.stamp.zh}`;
  const w = width * 1.1;
  const h = doc.heightOfString(text, { width: w, align: 'center' });
  doc.text(text, width / 2 - w / 2, height / 2 - h / 2, { width: w, align: 'center', lineBreak: true });
  doc.restore();
  doc.fillOpacity(1).fillColor(INK).font('body').fontSize(9);
}

/** The finished document as bytes. */
export function toBuffer(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
