// Checks an uploaded file by its content (magic bytes), never by its name or the client's type,
// decodes it fully (a truncated image is refused) and makes a thumbnail.
import { createHash } from 'node:crypto';
import path from 'node:path';
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from './errors';

export const MAX_UPLOAD_BYTES = 12 * 1024 * 1024;

const ACCEPTED: Record<string, { label: string; extensions: string[] }> = {
  'image/jpeg': { label: 'JPEG photo', extensions: ['.jpg', '.jpeg'] },
  'image/png': { label: 'PNG image', extensions: ['.png'] },
  'image/webp': { label: 'WebP image', extensions: ['.webp'] },
  'image/heic': { label: 'HEIC photo', extensions: ['.heic', '.heif'] },
};

export interface InspectedImage {
  contentType: string;
  size: number;
  sha256: string;
  width: number;
  height: number;
  thumbnail: Buffer;
}

const refuse = (message: string, status = 415) =>
  new AppError(status === 415 ? 'unsupported_media_type' : 'validation_failed', message, status, { file: [message] });

export async function inspectImage(data: Buffer, filename: string): Promise<InspectedImage> {
  if (data.length === 0) throw refuse('The file is empty. Pick the photo again.', 400);
  if (data.length > MAX_UPLOAD_BYTES) {
    throw new AppError('payload_too_large', `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB. Pick a smaller photo.`, 413);
  }
  const sniffed = await fileTypeFromBuffer(data);
  const accepted = sniffed && ACCEPTED[sniffed.mime];
  if (!sniffed || !accepted) {
    throw refuse('This file is not a photo Toolgate accepts. Use a JPEG, PNG or WebP image (SVG and documents are not accepted).');
  }
  // Content and name must agree: a PNG called .exe is as suspicious as an .exe called .png.
  const ext = path.extname(filename).toLowerCase();
  if (ext && !accepted.extensions.includes(ext)) {
    throw refuse(`The file is named "${ext}" but its content is a ${accepted.label}. Rename it to ${accepted.extensions[0]} and try again.`);
  }
  let thumbnail: Buffer;
  let width = 0;
  let height = 0;
  try {
    const decoded = sharp(data, { failOn: 'truncated' });
    const meta = await decoded.metadata();
    width = meta.width ?? 0;
    height = meta.height ?? 0;
    // A full decode: a truncated or corrupt file fails here instead of showing half a picture.
    await sharp(data, { failOn: 'truncated' }).raw().toBuffer();
    thumbnail = await sharp(data, { failOn: 'truncated' })
      .rotate()
      .resize(360, 360, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 78 })
      .toBuffer();
  } catch {
    throw refuse('The image is damaged or incomplete (perhaps the upload was cut off). Pick the photo again.', 400);
  }
  return { contentType: sniffed.mime, size: data.length, sha256: createHash('sha256').update(data).digest('hex'), width, height, thumbnail };
}
