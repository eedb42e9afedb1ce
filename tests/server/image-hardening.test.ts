import { deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { inspectImage, MAX_INPUT_PIXELS } from '../../server/lib/images';
import { AttachmentModel } from '../../server/models';
import { openTestApp, request } from './helpers';
import { createDraft, makeScene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

// CRC-32 of a PNG chunk (PNG specification, ISO/IEC 15948 annex D), written out so the test does not
// lean on the code under test.
const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
const crc32 = (buf: Buffer) => {
  let c = 0xffffffff;
  for (const b of buf) c = crcTable[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
};
const chunk = (type: string, data: Buffer) => {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
};

/** A valid grey PNG of side × side pixels, all zero: it compresses to almost nothing. */
function greyPng(side: number) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // greyscale
  const raw = Buffer.alloc((side + 1) * side); // a filter byte (0) and side pixels per row
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0))]);
}

describe('image limits and clean copies', () => {
  it('when a small file declares more pixels than the limit, then 413 naming its size, before it is decoded', async () => {
    const bomb = greyPng(8000); // 64 megapixels in well under 1 MB
    expect(bomb.length).toBeLessThan(1_000_000);
    expect(8000 * 8000).toBeGreaterThan(MAX_INPUT_PIXELS);
    await expect(inspectImage(bomb, 'bomb.png')).rejects.toMatchObject({
      status: 413,
      code: 'payload_too_large',
      message: expect.stringMatching(/8000 × 8000 pixels.*megapixels/),
      fieldErrors: { file: expect.any(Array) },
    });
  });

  it('when an image is under the limit, then it is accepted', async () => {
    const r = await inspectImage(greyPng(1000), 'grey.png');
    expect([r.width, r.height]).toEqual([1000, 1000]);
  });

  it('when a JPEG carries EXIF with a GPS position and bytes after its end, then the stored copy has neither', async () => {
    const withGps = await sharp({ create: { width: 320, height: 200, channels: 3, background: '#8795A1' } })
      .jpeg({ quality: 90 })
      .withExif({ IFD0: { Make: 'FactoryCam', ImageDescription: 'Bay 4 press 12' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '22/1 32/1 0/1' } })
      .toBuffer();
    expect((await sharp(withGps).metadata()).exif).toBeDefined();
    const upload = Buffer.concat([withGps, Buffer.from('HIDDEN-TRAILER-after-the-image-end')]);
    const r = await inspectImage(upload, 'press.jpg');
    expect(r.contentType).toBe('image/jpeg');
    const meta = await sharp(r.data).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(r.data.includes(Buffer.from('HIDDEN-TRAILER'))).toBe(false);
    expect(r.data.includes(Buffer.from('FactoryCam'))).toBe(false);
    // JPEG ends with the EOI marker FF D9 (ITU-T T.81, B.1.1.3) and nothing after it.
    expect(r.data.subarray(-2)).toEqual(Buffer.from([0xff, 0xd9]));
    expect([r.width, r.height]).toEqual([320, 200]);
  });

  it('when a PNG has bytes after its IEND chunk, then the stored copy ends at IEND', async () => {
    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#0F766E' } }).png().toBuffer();
    const r = await inspectImage(Buffer.concat([png, Buffer.from('<?php echo 1; ?>')]), 'sculpt.png');
    // The last 12 bytes of a PNG are the IEND chunk: length 0, "IEND", CRC AE 42 60 82 (PNG spec 11.2.5).
    expect(r.data.subarray(-12)).toEqual(Buffer.from([0, 0, 0, 0, 0x49, 0x45, 0x4e, 0x44, 0xae, 0x42, 0x60, 0x82]));
  });
});

describe('uploads through the API', () => {
  it('when a pixel bomb is uploaded, then 413 and nothing is stored', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set(s.users.designer.auth).field('kind', 'before').attach('file', greyPng(8000), 'bomb.png');
    expect(res.status).toBe(413);
    expect(res.body.error.fieldErrors.file[0]).toMatch(/megapixels/);
    expect(await AttachmentModel.count({ where: { requestId: d.id } })).toBe(0);
  });

  it('when a photo with a GPS position is uploaded, then what others download has no EXIF', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const photo = await sharp({ create: { width: 64, height: 64, channels: 3, background: '#445566' } })
      .jpeg()
      .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '22/1 32/1 0/1' } })
      .toBuffer();
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set(s.users.designer.auth).field('kind', 'before').attach('file', photo, 'press.jpg');
    expect(res.status).toBe(201);
    const got = await request(t.app)
      .get(res.body.url)
      .set(s.users.lead.auth)
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => cb(null, Buffer.concat(parts)));
      });
    expect(got.status).toBe(200);
    expect((await sharp(got.body as Buffer).metadata()).exif).toBeUndefined();
  });

  it.each([
    ['cut off', '--XB\r\nContent-Disposition: form-data; name="file"; filename="a.png"\r\nContent-Type: image/png\r\n\r\nabc'],
    ['broken part header', '--XB\r\nContent-Disposition form-data name\r\n\r\nabc\r\n--XB--\r\n'],
    ['no boundary in the body', 'just some text'],
  ])('when the multipart body is malformed (%s), then 400, never 500', async (_what, body) => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set(s.users.designer.auth).set('Content-Type', 'multipart/form-data; boundary=XB').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
  });
});
