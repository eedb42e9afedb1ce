// Checks an uploaded file by its content (magic bytes), never by its name or the client's type;
// refuses an image with more pixels than MAX_INPUT_PIXELS before anything is decoded (its size is
// read from the header); then decodes it fully (a truncated image is refused) into a fresh file of
// the same kind with no metadata (camera EXIF, GPS position, comments) and nothing after the image
// end, which is what is stored and shown; and makes a thumbnail from that clean copy.
import { createHash } from 'node:crypto';
import path from 'node:path';
import sharp, { type Metadata, type OutputInfo, type Sharp } from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from './errors';

export const MAX_UPLOAD_BYTES = 12 * 1024 * 1024;
/**
 * 40 megapixels: above a 12 MP phone photo and a 24 MP camera, below a decompression bomb. Decoding
 * costs about 3 to 4 bytes a pixel, so the worst accepted photo needs some 160 MB for a moment.
 */
export const MAX_INPUT_PIXELS = 40_000_000;

// Decoded pixels are not kept between uploads (each photo is seen once).
sharp.cache(false);

type Encoder = (s: Sharp) => Sharp;
const ACCEPTED: Record<string, { label: string; extensions: string[]; stored: string; encode: Encoder }> = {
  'image/jpeg': { label: 'JPEG photo', extensions: ['.jpg', '.jpeg'], stored: 'image/jpeg', encode: (s) => s.jpeg({ quality: 90 }) },
  'image/png': { label: 'PNG image', extensions: ['.png'], stored: 'image/png', encode: (s) => s.png({ compressionLevel: 8 }) },
  'image/webp': { label: 'WebP image', extensions: ['.webp'], stored: 'image/webp', encode: (s) => s.webp({ quality: 90 }) },
  // Stored as JPEG: browsers outside Safari do not show HEIC.
  'image/heic': { label: 'HEIC photo', extensions: ['.heic', '.heif'], stored: 'image/jpeg', encode: (s) => s.jpeg({ quality: 90 }) },
};
const EXTENSION_OF: Record<string, string> = { 'image/jpeg': '.jpg', 'image/png': '.png', 'image/webp': '.webp' };

export interface InspectedImage {
  /** The clean copy to store: re-encoded, no metadata, nothing after the image. */
  data: Buffer;
  contentType: string;
  /** Extension that matches contentType (the name of a HEIC upload changes to .jpg). */
  extension: string;
  size: number;
  sha256: string;
  width: number;
  height: number;
  thumbnail: Buffer;
}

const refuse = (message: string, status = 415) =>
  new AppError(status === 415 ? 'unsupported_media_type' : 'validation_failed', message, status, { file: [message] });

const decoder = (data: Buffer) => sharp(data, { failOn: 'truncated', limitInputPixels: MAX_INPUT_PIXELS });

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

  // The header only: nothing is decoded yet.
  let declared: Metadata;
  try {
    declared = await sharp(data).metadata();
  } catch {
    throw refuse('The image is damaged or incomplete (perhaps the upload was cut off). Pick the photo again.', 400);
  }
  const pixels = (declared.width ?? 0) * (declared.height ?? 0);
  if (pixels > MAX_INPUT_PIXELS) {
    const message = `The image is ${declared.width} × ${declared.height} pixels; Toolgate takes at most ${MAX_INPUT_PIXELS / 1_000_000} megapixels. Scale it down or lower the camera resolution, then upload it again.`;
    throw new AppError('payload_too_large', message, 413, { file: [message] });
  }

  let clean: { data: Buffer; info: OutputInfo };
  let thumbnail: Buffer;
  try {
    // A full decode into a fresh file: a truncated or corrupt file fails here; EXIF orientation is
    // applied to the pixels, then every piece of metadata is left out (sharp's default).
    clean = await accepted.encode(decoder(data).rotate()).toBuffer({ resolveWithObject: true });
    thumbnail = await decoder(clean.data).resize(360, 360, { fit: 'inside', withoutEnlargement: true }).webp({ quality: 78 }).toBuffer();
  } catch {
    throw refuse('The image is damaged or incomplete (perhaps the upload was cut off). Pick the photo again.', 400);
  }
  return {
    data: clean.data,
    contentType: accepted.stored,
    extension: EXTENSION_OF[accepted.stored],
    size: clean.data.length,
    sha256: createHash('sha256').update(clean.data).digest('hex'),
    width: clean.info.width,
    height: clean.info.height,
    thumbnail,
  };
}
