import { createHash } from 'node:crypto';
import sharp from 'sharp';
import { AttachmentModel, AuditEventModel } from '../../server/models';
import { MAX_UPLOAD_BYTES } from '../../server/lib/images';
import { attachmentSchema, requestDetailSchema } from '../../shared/schemas/change-requests';
import { openTestApp, request } from './helpers';
import { createDraft, insertItem, jpegImage, makeScene, photoJpeg, pngImage, putInState, ridgeItem, type Scene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

type User = { auth: Record<string, string> };

const upload = (u: User, requestId: string, file: Buffer, filename: string, fields: Record<string, string> = { kind: 'before' }) => {
  let req = request(t.app).post(`/api/requests/${requestId}/attachments`).set(u.auth);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', file, filename);
};

/** Reads a binary body as a Buffer. */
const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const fetchBytes = (u: User, path: string) => request(t.app).get(path).set(u.auth).buffer(true).parse(binary);

async function stored(requestId: string) {
  return {
    rows: await AttachmentModel.count({ where: { requestId } }),
    audits: await AuditEventModel.count({ where: { action: 'attachment.create', entity: 'attachment' } }),
  };
}

// The bytes of a Windows executable ("MZ" header), as in tests/server/images.test.ts.
const exe = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(300, 0x90), Buffer.from('PE\0\0')]);

describe('uploads that must be refused, with nothing stored', () => {
  let s: Scene;
  let id: string;
  beforeAll(async () => {
    s = await makeScene();
    id = (await createDraft(t.app, s)).id;
  });

  const cases: [string, () => Promise<Buffer>, string, number, string][] = [
    ['a PNG renamed .exe', () => pngImage(), 'sculpt.exe', 415, 'unsupported_media_type'],
    ['an .exe renamed .png', async () => exe, 'sculpt.png', 415, 'unsupported_media_type'],
    ['an empty file', async () => Buffer.alloc(0), 'empty.png', 400, 'validation_failed'],
    ['a truncated JPEG', async () => {
      const full = await photoJpeg();
      return full.subarray(0, Math.floor(full.length * 0.6));
    }, 'cut-off.jpg', 400, 'validation_failed'],
    [
      'an SVG with a script',
      async () => Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(document.cookie)</script><rect width="9" height="9"/></svg>'),
      'sketch.svg',
      415,
      'unsupported_media_type',
    ],
    ['an SVG renamed .png', async () => Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><rect width="9" height="9"/></svg>'), 'sketch.png', 415, 'unsupported_media_type'],
  ];

  it.each(cases)('when the file is %s, then a clear 4xx and no row', async (_name, make, filename, status, code) => {
    const before = await stored(id);
    const res = await upload(s.users.designer, id, await make(), filename);
    expect(res.status).toBe(status);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message.length).toBeGreaterThan(10);
    expect(await stored(id)).toEqual(before);
  });

  it('when the file is over 12 MB, then 413 and no row', async () => {
    const before = await stored(id);
    // A valid PNG header followed by padding: multer stops reading at the limit.
    const big = Buffer.concat([await pngImage(), Buffer.alloc(MAX_UPLOAD_BYTES + 1024, 7)]);
    const res = await upload(s.users.designer, id, big, 'huge.png');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'payload_too_large', message: expect.stringMatching(/12 MB/) });
    expect(await stored(id)).toEqual(before);
  });

  it('when no file is sent, or the kind or item is wrong, or two files come at once, then 400 and no row', async () => {
    const before = await stored(id);
    const noFile = await request(t.app).post(`/api/requests/${id}/attachments`).set(s.users.designer.auth).field('kind', 'before');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fieldErrors).toHaveProperty('file');
    const badKind = await upload(s.users.designer, id, await pngImage(), 'a.png', { kind: 'selfie' });
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fieldErrors).toHaveProperty('kind');
    const other = await createDraft(t.app, s);
    const foreignItem = await upload(s.users.designer, id, await pngImage(), 'a.png', { kind: 'after', itemId: other.items[0]!.id });
    expect(foreignItem.status).toBe(400);
    expect(foreignItem.body.error.fieldErrors).toHaveProperty('itemId');
    const two = await request(t.app)
      .post(`/api/requests/${id}/attachments`)
      .set(s.users.designer.auth)
      .field('kind', 'before')
      .attach('file', await pngImage(), 'a.png')
      .attach('file', await pngImage(), 'b.png');
    expect(two.status).toBe(400);
    expect(await stored(id)).toEqual(before);
  });
});

describe('a good upload', () => {
  it('when the designer uploads a PNG to their draft, then 201 with its SHA-256 and a thumbnail, served only to users who may see the request', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const png = await pngImage(800, 600);
    const res = await upload(s.users.designer, d.id, png, 'sculpt-before.png', { kind: 'before', itemId: d.items[0]!.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      kind: 'before',
      itemId: d.items[0]!.id,
      filename: 'sculpt-before.png',
      contentType: 'image/png',
      width: 800,
      height: 600,
      url: `/api/attachments/${res.body.id}`,
      thumbnailUrl: `/api/attachments/${res.body.id}/thumbnail`,
      uploadedBy: { id: s.users.designer.user.id, name: s.users.designer.user.name },
    });

    expect(() => attachmentSchema.parse(res.body)).not.toThrow();

    const original = await fetchBytes(s.users.lead, res.body.url);
    expect(original.status).toBe(200);
    expect(original.headers['content-type']).toBe('image/png');
    expect(original.headers['cache-control']).toMatch(/^private/);
    expect(original.headers['x-content-type-options']).toBe('nosniff');
    // What is served is the stored clean copy, and size and SHA-256 describe it.
    expect(original.body.length).toBe(res.body.size);
    expect(createHash('sha256').update(original.body as Buffer).digest('hex')).toBe(res.body.sha256);

    const thumb = await fetchBytes(s.users.engineer, res.body.thumbnailUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(thumb.headers['cache-control']).toMatch(/^private/);
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect(meta.format).toBe('webp');
    expect(Math.max(meta.width!, meta.height!)).toBe(360);

    for (const u of [s.users.otherLead, s.users.toolmaker, s.users.otherToolmaker]) {
      expect((await fetchBytes(u, res.body.url)).status).toBe(404);
      expect((await fetchBytes(u, res.body.thumbnailUrl)).status).toBe(404);
    }
    const detail = await request(t.app).get(`/api/requests/${d.id}`).set(s.users.engineer.auth);
    expect(detail.body.attachments).toEqual([res.body]);
    expect(() => requestDetailSchema.parse(detail.body)).not.toThrow();

    const audit = await AuditEventModel.findOne({ where: { action: 'attachment.create', entityId: res.body.id } });
    expect(audit!.after).toMatchObject({ requestId: d.id, sha256: res.body.sha256, size: res.body.size });
  });

  it('when ten photos are uploaded in a row, then all ten are stored', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const res = await upload(s.users.designer, d.id, await pngImage(320 + i, 240, i % 2 ? '#C2410C' : '#0F766E'), `photo-${i}.png`, { kind: i % 2 ? 'after' : 'before' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual(Array(10).fill(201));
    expect(await AttachmentModel.count({ where: { requestId: d.id } })).toBe(10);
    const detail = await request(t.app).get(`/api/requests/${d.id}`).set(s.users.designer.auth);
    expect(detail.body.attachments.map((a: { filename: string }) => a.filename)).toEqual(Array.from({ length: 10 }, (_, i) => `photo-${i}.png`));
  });

  it('when a JPEG from a phone is uploaded, then it is accepted as image/jpeg', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await upload(s.users.designer, d.id, await jpegImage(), 'IMG_0042.JPG', { kind: 'after' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ contentType: 'image/jpeg', width: 640, height: 480 });
  });
});

describe('who may add and remove files', () => {
  it('when another designer, an admin or a brand lead uploads to a draft, then 403; an engineer on a draft, 409; a toolmaker, 404; nothing stored', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const png = await pngImage();
    expect((await upload(s.users.otherDesigner, d.id, png, 'a.png')).status).toBe(403);
    expect((await upload(s.users.admin, d.id, png, 'a.png')).status).toBe(403);
    expect((await upload(s.users.lead, d.id, png, 'a.png')).status).toBe(403);
    const eng = await upload(s.users.engineer, d.id, png, 'a.png');
    expect(eng.status).toBe(409);
    expect(eng.body.error.code).toBe('wrong_state');
    expect((await upload(s.users.toolmaker, d.id, png, 'a.png')).status).toBe(404);
    expect(await AttachmentModel.count({ where: { requestId: d.id } })).toBe(0);
  });

  it('when the request is in engineering review, then the engineer may upload and the designer may not', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    await putInState(d.id, 'engineering_review');
    expect((await upload(s.users.engineer, d.id, await pngImage(), 'marked.png', { kind: 'after' })).status).toBe(201);
    expect((await upload(s.users.designer, d.id, await pngImage(), 'late.png')).status).toBe(409);
  });

  it('when the cut is cleared, then the toolmaker of the factory and the engineer may add sample photos only', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    await putInState(d.id, 'cut_authorized');
    const sample = await upload(s.users.toolmaker, d.id, await pngImage(), 'first-shot.png', { kind: 'sample' });
    expect(sample.status).toBe(201);
    const before = await upload(s.users.toolmaker, d.id, await pngImage(), 'x.png', { kind: 'before' });
    expect(before.status).toBe(403);
    expect(before.body.error.fieldErrors).toHaveProperty('kind');
    expect((await upload(s.users.engineer, d.id, await pngImage(), 'eng-sample.png', { kind: 'sample' })).status).toBe(201);
    expect((await upload(s.users.otherToolmaker, d.id, await pngImage(), 'x.png', { kind: 'sample' })).status).toBe(404);
    expect((await upload(s.users.designer, d.id, await pngImage(), 'x.png', { kind: 'sample' })).status).toBe(409);
    await putInState(d.id, 'closed');
    expect((await upload(s.users.toolmaker, d.id, await pngImage(), 'late.png', { kind: 'sample' })).status).toBe(409);
    expect(await AttachmentModel.count({ where: { requestId: d.id } })).toBe(2);
  });

  it('when the designer removes a file from the draft, then 204, the bytes are gone and the audit keeps what it was', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const a = (await upload(s.users.designer, d.id, await pngImage(), 'gone.png')).body;
    expect((await request(t.app).delete(`/api/requests/${d.id}/attachments/${a.id}`).set(s.users.otherDesigner.auth)).status).toBe(403);
    const res = await request(t.app).delete(`/api/requests/${d.id}/attachments/${a.id}`).set(s.users.designer.auth);
    expect(res.status).toBe(204);
    expect((await fetchBytes(s.users.designer, a.url)).status).toBe(404);
    const audit = await AuditEventModel.findOne({ where: { action: 'attachment.delete', entityId: a.id } });
    expect(audit).toMatchObject({ after: null, before: { filename: 'gone.png', sha256: a.sha256 } });
    expect((await request(t.app).delete(`/api/requests/${d.id}/attachments/${a.id}`).set(s.users.designer.auth)).status).toBe(404);
  });

  it('when the request has left the draft, then the designer can no longer remove its files (409)', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const a = (await upload(s.users.designer, d.id, await pngImage(), 'kept.png')).body;
    await putInState(d.id, 'brand_approval');
    expect((await request(t.app).delete(`/api/requests/${d.id}/attachments/${a.id}`).set(s.users.designer.auth)).status).toBe(409);
    expect(await AttachmentModel.count({ where: { id: a.id } })).toBe(1);
  });

  it('when the item a file marks is removed from the request, then the file stays on the request without an item', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { items: [ridgeItem(s.head.id), insertItem(s.visor.id)] });
    const a = (await upload(s.users.designer, d.id, await pngImage(), 'ridge.png', { kind: 'after', itemId: d.items[0]!.id })).body;
    const res = await request(t.app)
      .patch(`/api/requests/${d.id}`)
      .set(s.users.designer.auth)
      .send({ version: d.version, items: [insertItem(s.visor.id, { id: d.items[1]!.id })] });
    expect(res.status).toBe(200);
    expect(res.body.attachments).toEqual([expect.objectContaining({ id: a.id, itemId: null })]);
  });
});
