import sharp from 'sharp';
import { createHash } from 'node:crypto';
import { inspectImage, MAX_UPLOAD_BYTES } from '../../server/lib/images';

const png = () => sharp({ create: { width: 64, height: 48, channels: 3, background: '#0F766E' } }).png().toBuffer();
const jpeg = () => sharp({ create: { width: 640, height: 480, channels: 3, background: '#8795A1' } }).jpeg({ quality: 90 }).toBuffer();
// The two bytes every Windows executable starts with ("MZ"), then padding.
const exe = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(300, 0x90), Buffer.from('PE\0\0')]);

describe('inspectImage', () => {
  it('when a PNG is named .png, then it is accepted with its SHA-256 and a WebP thumbnail', async () => {
    const data = await png();
    const r = await inspectImage(data, 'sculpt-before.png');
    expect(r.contentType).toBe('image/png');
    expect(r.sha256).toBe(createHash('sha256').update(r.data).digest('hex'));
    expect([r.width, r.height]).toEqual([64, 48]);
    expect((await sharp(r.thumbnail).metadata()).format).toBe('webp');
  });

  it('when a PNG is renamed .exe, then 415 saying the name and content disagree', async () => {
    await expect(inspectImage(await png(), 'photo.exe')).rejects.toMatchObject({ status: 415, message: expect.stringMatching(/named "\.exe"/) });
  });

  it('when an .exe is renamed .png, then 415 not a photo', async () => {
    await expect(inspectImage(exe, 'photo.png')).rejects.toMatchObject({ status: 415, code: 'unsupported_media_type' });
  });

  it('when the file is empty, then 400', async () => {
    await expect(inspectImage(Buffer.alloc(0), 'x.png')).rejects.toMatchObject({ status: 400, message: expect.stringMatching(/empty/) });
  });

  it('when the file is over the limit, then 413', async () => {
    await expect(inspectImage(Buffer.alloc(MAX_UPLOAD_BYTES + 1, 1), 'big.jpg')).rejects.toMatchObject({ status: 413 });
  });

  it('when a JPEG is truncated, then 400 damaged or incomplete', async () => {
    const full = await jpeg();
    await expect(inspectImage(full.subarray(0, Math.floor(full.length / 2)), 'cut.jpg')).rejects.toMatchObject({
      status: 400,
      message: expect.stringMatching(/damaged or incomplete/),
    });
  });

  it('when an SVG carries a script, then 415 (SVG is never accepted)', async () => {
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script><rect width="10" height="10"/></svg>');
    await expect(inspectImage(svg, 'mark.svg')).rejects.toMatchObject({ status: 415 });
  });
});
