// The cut sheet (改模单): the printable PDF the factory cuts from, built from the signed record.
// Access is the request's own: whoever may see the request may print it; others get 404.
import sharp from 'sharp';
import { dimensionCheck, type DimensionResult } from '../../../shared/domain/request-numbers';
import { requestRef, type RequestDetail } from '../../../shared/schemas/change-requests';
import type { Actor } from '../../lib/auth';
import { AttachmentModel, ChangeRequestModel } from '../../models';
import { detailById } from '../request-views';
import { storedInputs } from '../request-numbers';
import { finishPages, newDocument, toBuffer, type Paper } from './layout';
import { cautionsBlock, endedBlock, firstArticleBlock, imagesBlock, itemsBlock, recordBlock, steelSizeBlock, titleBlock, toolBlock, type SheetData, type SheetImage } from './sections';

export { papers, type Paper } from './layout';

/** States in which the sheet may be used to cut steel; before them every page is stamped. */
export const CUTTABLE_STATES = ['cut_authorized', 'samples_review', 'closed'] as const;

/** Longest side of an image as embedded (enough for print at the sizes used, keeps the file small). */
const IMAGE_MAX_PX = 1400;

async function sheetImages(detail: RequestDetail): Promise<SheetImage[]> {
  const rows = await AttachmentModel.findAll({
    where: { requestId: detail.id, kind: ['before', 'after'] },
    attributes: ['id', 'kind', 'itemId', 'filename', 'data'],
    order: [['kind', 'DESC'], ['createdAt', 'ASC'], ['id', 'ASC']],
  });
  const images: SheetImage[] = [];
  for (const a of rows) {
    const { data, info } = await sharp(a.data).rotate().resize({ width: IMAGE_MAX_PX, height: IMAGE_MAX_PX, fit: 'inside', withoutEnlargement: true }).flatten({ background: '#FFFFFF' }).jpeg({ quality: 82 }).toBuffer({ resolveWithObject: true });
    const kind = a.kind as 'before' | 'after';
    const marks = detail.items.flatMap((item, i) =>
      item.region && item.region.imageRole === kind && (a.itemId === null || a.itemId === item.id) ? [{ number: i + 1, mark: item.region }] : [],
    );
    images.push({ kind, jpeg: data, width: info.width, height: info.height, marks, filename: a.filename });
  }
  return images;
}

async function dimensionOf(id: string): Promise<DimensionResult | null> {
  const r = await ChangeRequestModel.findByPk(id, { attributes: ['id', 'estimate', 'numbersInputs'] });
  const dim = r ? storedInputs(r).inputs.dimension : null;
  if (!dim) return null;
  try {
    return dimensionCheck(dim);
  } catch {
    return null; // a stored check that no longer computes is left off the sheet
  }
}

/** The data on the sheet, for a caller who may see the request (otherwise 404). */
export async function cutSheetData(actor: Actor, id: string): Promise<SheetData> {
  const detail = await detailById(actor, id);
  const signOffs = detail.signOffs ?? [];
  return {
    ref: requestRef(detail.number),
    detail,
    images: await sheetImages(detail),
    dimension: await dimensionOf(id),
    chainHead: signOffs.length ? signOffs[signOffs.length - 1]!.hash : null,
  };
}

export function renderCutSheet(d: SheetData, paper: Paper): Promise<Buffer> {
  const doc = newDocument(paper, { title: `${d.detail.tool.code} ${d.ref} cut sheet 改模单`, subject: d.detail.title });
  titleBlock(doc, d);
  toolBlock(doc, d);
  itemsBlock(doc, d);
  steelSizeBlock(doc, d);
  imagesBlock(doc, d);
  endedBlock(doc, d);
  cautionsBlock(doc, d);
  firstArticleBlock(doc, d);
  recordBlock(doc, d);
  const stamped = !(CUTTABLE_STATES as readonly string[]).includes(d.detail.status);
  finishPages(doc, { ref: `${d.detail.tool.code} · ${d.ref}`, contentHash: d.detail.workflow?.currentContentHash ?? '' }, stamped);
  return toBuffer(doc);
}

export interface CutSheetFile {
  filename: string;
  data: Buffer;
}

export async function buildCutSheet(actor: Actor, id: string, paper: Paper): Promise<CutSheetFile> {
  const d = await cutSheetData(actor, id);
  return { filename: `${d.detail.tool.code}-${d.ref}-cut-sheet-${paper}.pdf`.replace(/[^A-Za-z0-9._-]/g, '_'), data: await renderCutSheet(d, paper) };
}

/** The mail worker's reader: the whole record, as an administrator sees it. */
const RECORD_READER: Actor = { id: '00000000-0000-0000-0000-000000000000', email: '', name: 'Toolgate', role: 'admin', timeZone: 'UTC', factoryId: null, brandIds: [] };

export const buildCutSheetForMail = (id: string, paper: Paper) => buildCutSheet(RECORD_READER, id, paper);
