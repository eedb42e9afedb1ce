// Images of a change request: upload (checked by content in server/lib/images.ts), remove, and
// serve the bytes or the thumbnail only to users who may see the request.
import type { Sequelize, Transaction } from 'sequelize';
import { uploadKindInput, type Attachment, type AttachmentKind } from '../../shared/schemas/change-requests';
import type { Actor } from '../lib/auth';
import { AppError, notFound } from '../lib/errors';
import { inspectImage, type InspectedImage } from '../lib/images';
import { AttachmentModel, ChangeItemModel, ChangeRequestModel } from '../models';
import { recordAudit } from './audit';
import { canSeeRequest, uploadRefusal } from './request-access';
import { accessFacts, findVisibleRequest, toAttachmentDto } from './request-views';

/** Most files on one request (before/after per item plus samples fits well within this). */
export const MAX_ATTACHMENTS_PER_REQUEST = 60;

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/** A file name safe to store and to put in a header: no path, no control characters, at most 200. */
export function safeFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // Lone surrogates (half characters) become U+FFFD, which every store and JSON column takes.
  // (after the cut to 200, which may split a pair).
  const clean = base.replace(/[\u0000-\u001f\u007f"]/g, '').trim().slice(-200).replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');
  return clean || 'photo';
}

const metadata = (a: AttachmentModel) => ({
  requestId: a.requestId,
  itemId: a.itemId,
  kind: a.kind,
  filename: a.filename,
  contentType: a.contentType,
  size: a.size,
  sha256: a.sha256,
  width: a.width,
  height: a.height,
  uploadedBy: a.uploadedBy,
});

/**
 * Before the file is read: the caller may see the request (else 404) and may add files to it now
 * (else 403 or 409). The kind is checked once the fields are read.
 */
export async function checkMayUpload(actor: Actor, requestId: string): Promise<void> {
  const r = await findVisibleRequest(actor, requestId);
  const refusal = uploadRefusal(actor, accessFacts(r));
  if (refusal) throw refusal;
}

async function lockedRequest(actor: Actor, requestId: string, transaction: Transaction) {
  return findVisibleRequest(actor, requestId, { transaction, lock: true });
}

/**
 * Stores one checked image. Nothing is written unless every check passes: the fields, the item,
 * the content (magic bytes, name agreement, full decode), the caller's right at this stage.
 */
export async function uploadAttachment(
  sequelize: Sequelize,
  actor: Actor,
  requestId: string,
  fields: unknown,
  file: UploadedFile | undefined,
): Promise<Attachment> {
  const { kind, itemId } = uploadKindInput.parse(fields ?? {});
  if (!file) throw new AppError('validation_failed', 'Choose a photo to upload (multipart field "file").', 400, { file: ['Choose a photo'] });
  const given = safeFilename(file.originalname);
  const image: InspectedImage = await inspectImage(file.buffer, given);
  // A HEIC photo is stored as JPEG: its name says so.
  const filename = /\.(heic|heif)$/i.test(given) ? given.replace(/\.[^.]*$/, image.extension) : given;

  return sequelize.transaction(async (transaction) => {
    const r = await lockedRequest(actor, requestId, transaction);
    const refusal = uploadRefusal(actor, accessFacts(r), kind);
    if (refusal) throw refusal;
    if (itemId && !(await ChangeItemModel.findOne({ where: { id: itemId, requestId }, attributes: ['id'], transaction }))) {
      throw new AppError('validation_failed', 'That cut item is not on this request', 400, { itemId: ['Pick an item of this request'] });
    }
    const count = await AttachmentModel.count({ where: { requestId }, transaction });
    if (count >= MAX_ATTACHMENTS_PER_REQUEST) {
      throw new AppError('conflict', `This request already has ${count} files, the most it can hold: remove one first.`, 409);
    }
    const a = await AttachmentModel.create(
      {
        requestId,
        itemId: itemId ?? null,
        kind,
        filename,
        contentType: image.contentType,
        size: image.size,
        sha256: image.sha256,
        width: image.width || null,
        height: image.height || null,
        data: image.data,
        thumbnail: image.thumbnail,
        uploadedBy: actor.id,
      },
      { transaction },
    );
    await recordAudit(transaction, actor, 'attachment.create', 'attachment', a.id, null, metadata(a));
    return toAttachmentDto(a, { id: actor.id, name: actor.name });
  });
}

export async function deleteAttachment(sequelize: Sequelize, actor: Actor, requestId: string, attachmentId: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const r = await lockedRequest(actor, requestId, transaction);
    const a = await AttachmentModel.findOne({ where: { id: attachmentId, requestId }, attributes: { exclude: ['data', 'thumbnail'] }, transaction });
    if (!a) throw notFound('Attachment');
    const refusal = uploadRefusal(actor, accessFacts(r), a.kind as AttachmentKind);
    if (refusal) throw refusal;
    const before = metadata(a);
    await a.destroy({ transaction });
    await recordAudit(transaction, actor, 'attachment.delete', 'attachment', attachmentId, before, null);
  });
}

export interface AttachmentBytes {
  contentType: string;
  data: Buffer;
  filename: string;
  sha256: string;
}

/** The original bytes or the thumbnail, for a user who may see the request; otherwise 404. */
export async function readAttachment(actor: Actor, id: string, which: 'original' | 'thumbnail'): Promise<AttachmentBytes> {
  const a = await AttachmentModel.findByPk(id, {
    attributes: ['id', 'requestId', 'contentType', 'filename', 'sha256', which === 'original' ? 'data' : 'thumbnail'],
    include: [{ model: ChangeRequestModel, as: 'request', attributes: ['id', 'status', 'submitterId', 'toolId'], include: [{ association: 'tool', attributes: ['id', 'brandId', 'factoryId'] }] }],
  });
  const r = a?.request;
  if (!a || !r || !canSeeRequest(actor, accessFacts(r))) throw notFound('Attachment');
  if (which === 'thumbnail') {
    if (!a.thumbnail) throw notFound('Thumbnail');
    return { contentType: 'image/webp', data: a.thumbnail, filename: a.filename.replace(/\.[^.]*$/, '') + '-thumbnail.webp', sha256: a.sha256 };
  }
  return { contentType: a.contentType, data: a.data, filename: a.filename, sha256: a.sha256 };
}
