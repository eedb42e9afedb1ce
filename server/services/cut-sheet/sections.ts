// The sections of the cut sheet, top to bottom. Each draws from plain data (see index.ts).
import { riggingCaution } from '../../../shared/domain/handling';
import type { SafetyCaution } from '../../../shared/domain/safety';
import type { RegionMark } from '../../../shared/schemas/change-items';
import type { RequestDetail } from '../../../shared/schemas/change-requests';
import type { DimensionResult } from '../../../shared/domain/request-numbers';
import { bilingualParagraph, contentWidth, ensureSpace, field, heading, INK, MARK, MARGIN, MUTED, paragraph, RULE, type Doc } from './layout';
import { checkLine, effectLabels, flagLabels, L, methodLabels, roleLabels, stateLabels, steelActionLabels, undoPathLabels, type Bilingual } from './labels';

export interface SheetImage {
  kind: 'before' | 'after';
  /** JPEG bytes, already scaled for print. */
  jpeg: Buffer;
  width: number;
  height: number;
  /** The marks drawn on it, with the number of the item they belong to (1-based). */
  marks: { number: number; mark: RegionMark }[];
  filename: string;
}

export interface SheetData {
  ref: string;
  detail: RequestDetail;
  images: SheetImage[];
  dimension: DimensionResult | null;
  chainHead: string | null;
}

const both = (l: Bilingual) => `${l.en} · ${l.zh}`;

export function titleBlock(doc: Doc, d: SheetData) {
  const r = d.detail;
  doc.font('bold').fontSize(18).fillColor(INK).text(`${L.sheet.en}  ${L.sheet.zh}`, MARGIN, MARGIN);
  doc.font('bold').fontSize(13).text(`${r.tool.code} · ${d.ref}`);
  doc.font('body').fontSize(10).fillColor(MUTED).text(r.title);
  doc.fillColor(INK).moveDown(0.4);
  if (!['cut_authorized', 'samples_review', 'closed'].includes(r.status)) {
    const y = doc.y;
    const w = contentWidth(doc);
    doc.rect(MARGIN, y, w, 30).fillColor('#FBE9EA').fill();
    doc.fillColor(MARK).font('bold').fontSize(9).text(L.stampNote.en, MARGIN + 6, y + 4, { width: w - 12 });
    doc.font('body').text(L.stampNote.zh, { width: w - 12 });
    doc.fillColor(INK);
    doc.y = y + 36;
  }
}

export function toolBlock(doc: Doc, d: SheetData) {
  const r = d.detail;
  heading(doc, L.tool);
  field(doc, L.tool, r.tool.code, { bold: true });
  field(doc, L.toolName, r.tool.name);
  field(doc, L.revision, `R${r.workflow?.baseRevision ?? r.tool.currentRevision}`, { bold: true });
  field(doc, L.factory, r.tool.factory.name);
  field(doc, L.state, both(stateLabels[r.status]));
  field(doc, L.derivative, r.derivativeProduct ? `${r.derivativeProduct.sku} ${r.derivativeProduct.name}` : `${both(L.noDerivative)}${r.noDerivativeReason ? `: ${r.noDerivativeReason}` : ''}`);
  if (r.reason) field(doc, L.reason, r.reason);
}

export function itemsBlock(doc: Doc, d: SheetData) {
  heading(doc, L.items);
  d.detail.items.forEach((item, i) => {
    // Keep an item on one page (about 150 pt; a long note may still run over).
    ensureSpace(doc, 150);
    const y = doc.y;
    doc.circle(MARGIN + 9, y + 9, 9).fillColor(MARK).fill();
    doc.font('bold').fontSize(10).fillColor('#FFFFFF').text(String(i + 1), MARGIN, y + 3.5, { width: 18, align: 'center' });
    doc.fillColor(INK).font('bold').fontSize(11).text(item.partName, MARGIN + 26, y + 2, { width: contentWidth(doc) - 26 });
    doc.y = Math.max(doc.y, y + 22);
    const opts = { x: MARGIN + 26, width: contentWidth(doc) - 26, labelWidth: 170 };
    field(doc, L.effect, both(effectLabels[item.effect]), opts);
    field(doc, L.method, both(methodLabels[item.method]), opts);
    field(doc, L.size, `${item.size} ${item.unit}`, { ...opts, bold: true });
    field(doc, L.steelAction, both(steelActionLabels[item.steel.steelAction] ?? { en: item.steel.steelAction, zh: '' }), opts);
    field(doc, L.undoPath, both(undoPathLabels[item.steel.undoPath] ?? { en: item.steel.undoPath, zh: '' }), opts);
    field(doc, L.safety, item.safetyFlags.length ? item.safetyFlags.map((f) => both(flagLabels[f])).join('\n') : both(L.none), opts);
    if (item.note) field(doc, L.note, item.note, opts);
    doc.moveTo(MARGIN, doc.y + 2).lineTo(MARGIN + contentWidth(doc), doc.y + 2).lineWidth(0.3).strokeColor(RULE).stroke();
    doc.y += 6;
  });
}

export function steelSizeBlock(doc: Doc, d: SheetData) {
  const dim = d.dimension;
  if (!dim) return;
  heading(doc, L.steelSize);
  field(doc, L.shrink, `${dim.shrink} (${dim.resin.name}; ${dim.convention.label}: ${dim.convention.formula})`);
  field(doc, L.oldSteel, `${dim.change.oldSteelMm} mm`);
  field(doc, L.newSteel, `${dim.change.newSteelMm} mm`, { bold: true });
  field(doc, L.steelAction, `${dim.change.sentence}`);
  paragraph(doc, `${dim.rounding} ${dim.caution}`, { size: 8, color: MUTED });
}

/** Before and after images, scaled to the page, with each item's region marked and numbered. */
export function imagesBlock(doc: Doc, d: SheetData) {
  heading(doc, L.images);
  if (d.images.length === 0) {
    bilingualParagraph(doc, L.noImages);
    return;
  }
  const maxW = contentWidth(doc);
  const maxH = 250;
  for (const img of d.images) {
    const scale = Math.min(maxW / img.width, maxH / img.height, 1.5);
    const w = img.width * scale;
    const h = img.height * scale;
    ensureSpace(doc, h + 30);
    const label = img.kind === 'before' ? L.before : L.after;
    doc.font('bold').fontSize(9).fillColor(INK).text(`${label.en} ${label.zh} · ${img.filename}`, MARGIN, doc.y, { width: maxW });
    const x = MARGIN;
    const y = doc.y + 2;
    doc.image(img.jpeg, x, y, { width: w, height: h });
    doc.rect(x, y, w, h).lineWidth(0.5).strokeColor(RULE).stroke();
    for (const { number, mark } of img.marks) {
      const mx = x + mark.x * w;
      const my = y + mark.y * h;
      const mw = mark.w * w;
      const mh = mark.h * h;
      doc.lineWidth(2).strokeColor(MARK);
      if (mark.shape === 'circle') doc.ellipse(mx + mw / 2, my + mh / 2, mw / 2, mh / 2).stroke();
      else doc.rect(mx, my, mw, mh).stroke();
      doc.circle(mx, my, 8).fillColor(MARK).fill();
      doc.font('bold').fontSize(9).fillColor('#FFFFFF').text(String(number), mx - 8, my - 5.5, { width: 16, align: 'center', lineBreak: false });
    }
    doc.fillColor(INK);
    doc.y = y + h + 10;
    doc.x = MARGIN;
  }
}

export function endedBlock(doc: Doc, d: SheetData) {
  heading(doc, L.ended);
  const ended = d.detail.impact.endedProducts;
  if (ended.length === 0) return bilingualParagraph(doc, L.endedNone);
  for (const p of ended) paragraph(doc, `• ${p.sku} ${p.name}`);
}

export function cautionsBlock(doc: Doc, d: SheetData) {
  heading(doc, L.cautions);
  const cautions: SafetyCaution[] = d.detail.safety.cautions;
  for (const c of cautions) {
    ensureSpace(doc, 60);
    paragraph(doc, both(flagLabels[c.flag]), { bold: true, color: MARK });
    for (const s of c.sentences) paragraph(doc, `• ${s}`, { size: 8.5, indent: 8 });
    doc.moveDown(0.3);
  }
  if (d.detail.safety.closing) paragraph(doc, d.detail.safety.closing, { size: 8.5, color: MUTED });
  const rig = riggingCaution(d.detail.tool.weightKg);
  ensureSpace(doc, 80);
  doc.moveDown(0.3);
  paragraph(doc, both(L.lifting), { bold: true, color: MARK });
  for (const s of rig.sentences) paragraph(doc, `• ${s}`, { size: 8.5, indent: 8 });
}

export function recordBlock(doc: Doc, d: SheetData) {
  heading(doc, L.record);
  const list = d.detail.signOffs ?? [];
  if (list.length === 0) bilingualParagraph(doc, L.noSignOffs);
  for (const s of list) {
    ensureSpace(doc, 70);
    const role = roleLabels[s.role] ?? { en: s.roleLabel, zh: '' };
    paragraph(doc, `${s.seq}. ${s.signer.printedName} · ${role.en} ${role.zh} · ${s.actionLabel}`, { bold: true });
    field(doc, L.signedAt, s.signedAt.replace('T', ' ').replace(/\.\d+Z$/, ' UTC').replace(/Z$/, ' UTC'), { x: MARGIN + 12, width: contentWidth(doc) - 12 });
    if (s.meaning) field(doc, L.meaning, s.meaning, { x: MARGIN + 12, width: contentWidth(doc) - 12 });
    if (s.comment) field(doc, L.note, s.comment, { x: MARGIN + 12, width: contentWidth(doc) - 12 });
  }
  doc.moveDown(0.4);
  field(doc, L.chainHead, d.chainHead ?? '–', { bold: true });
  const check = checkLine(d.detail.id);
  field(doc, L.check, `${check.en}\n${check.zh}`);
}

/** The first shots as measured by the factory, item by item, once the cut is recorded. */
export function firstArticleBlock(doc: Doc, d: SheetData) {
  const cut = d.detail.workflow?.cutReport;
  if (!cut?.firstArticle?.length) return;
  heading(doc, L.firstArticle);
  if (cut.trialOn) field(doc, L.trial, `${cut.trialOn}${cut.trialShots !== undefined ? ` · ${cut.trialShots} shots 模次` : ''}`);
  for (const f of cut.firstArticle) {
    const verdict = f.pass ? L.pass : L.fail;
    field(
      doc,
      { en: `${f.position + 1}. ${f.partName}`, zh: '' },
      `${L.intended.en} ${L.intended.zh} ${f.intended} ± ${f.tolerance} ${f.unit} · ${L.measured.en} ${L.measured.zh} ${f.measured} ${f.unit} · ${verdict.en} ${verdict.zh}`,
    );
  }
}

