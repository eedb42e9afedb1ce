import sharp from 'sharp';
import { AttachmentModel, ProductModel } from '../../server/models';
import { env } from '../../server/env';
import { openTestApp, PASSWORD, request, uid } from './helpers';
import { createDraft, makeScene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

const FOREIGN = 'https://evil.example';
const OWN = new URL(env.PUBLIC_URL).origin;

/** Signs in through the API and returns the session cookie the browser would keep. */
async function cookieOf(email: string) {
  const res = await request(t.app).post('/api/auth/sign-in').send({ email, password: PASSWORD });
  expect(res.status).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0]!;
}

describe('cross-site writes', () => {
  it('when a page on another site posts a CSV as text/plain with the engineer cookie, then 403 and no product is made', async () => {
    const s = await makeScene();
    const cookie = await cookieOf(s.users.engineer.user.email);
    const sku = `XS-${uid()}`;
    const csv = `sku,name,brand_code\n${sku},Cross-site figure,${s.brand.code}\n`;
    const res = await request(t.app).post('/api/registry/import').query({ kind: 'products', dryRun: 'false' }).set('Cookie', cookie).set('Origin', FOREIGN).set('Content-Type', 'text/plain').send(csv);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/another website/);
    expect(await ProductModel.count({ where: { sku } })).toBe(0);
  });

  it('when a page on another site posts a multipart upload with the designer cookie, then 403 and nothing is stored', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const cookie = await cookieOf(s.users.designer.user.email);
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } }).png().toBuffer();
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set('Cookie', cookie).set('Origin', FOREIGN).field('kind', 'before').attach('file', png, 'a.png');
    expect(res.status).toBe(403);
    expect(await AttachmentModel.count({ where: { requestId: d.id } })).toBe(0);
  });

  it('when the browser says the request is cross-site, then 403 even without an Origin', async () => {
    const s = await makeScene();
    const cookie = await cookieOf(s.users.engineer.user.email);
    const res = await request(t.app).post('/api/brands').set('Cookie', cookie).set('Sec-Fetch-Site', 'cross-site').send({ code: 'ZZ', name: 'x' });
    expect(res.status).toBe(403);
  });

  it('when the app itself posts with the cookie from its own origin, then the write goes through', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const cookie = await cookieOf(s.users.designer.user.email);
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } }).png().toBuffer();
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set('Cookie', cookie).set('Origin', OWN).field('kind', 'before').attach('file', png, 'a.png');
    expect(res.status).toBe(201);
  });
});

describe('content types per route', () => {
  it('when the CSV import is sent as text/plain (even with a token), then 415 and nothing is written', async () => {
    const s = await makeScene();
    const sku = `XS-${uid()}`;
    const res = await request(t.app)
      .post('/api/registry/import')
      .query({ kind: 'products', dryRun: 'false' })
      .set(s.users.engineer.auth)
      .set('Content-Type', 'text/plain')
      .send(`sku,name,brand_code\n${sku},Plain figure,${s.brand.code}\n`);
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_media_type', message: expect.stringMatching(/CSV/) });
    expect(await ProductModel.count({ where: { sku } })).toBe(0);
  });

  it('when a JSON route is sent a form-encoded or multipart body, then 415', async () => {
    const s = await makeScene();
    const form = await request(t.app).post(`/api/requests`).set(s.users.designer.auth).type('form').send({ title: 'x' });
    expect(form.status).toBe(415);
    const multi = await request(t.app).post('/api/tools').set(s.users.engineer.auth).field('code', 'X');
    expect(multi.status).toBe(415);
  });
});
