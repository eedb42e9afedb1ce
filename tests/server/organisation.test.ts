import { makeUser, openTestApp, request, uid } from './helpers';
import type { Role } from '../../shared/schemas/users';

const t = openTestApp();
afterAll(() => t.close());

const code = () => `Z${uid().slice(0, 5).toUpperCase().replace(/[^A-Z0-9]/g, '0')}`;

describe('brands and factories', () => {
  it.each<Role>(['designer', 'engineer', 'brand_lead', 'toolmaker', 'admin'])('when a %s lists brands and factories, then 200', async (role) => {
    const { auth } = await makeUser(role);
    expect((await request(t.app).get('/api/brands').set(auth)).status).toBe(200);
    expect((await request(t.app).get('/api/factories').set(auth)).status).toBe(200);
  });

  it('when signed out, then 401', async () => {
    expect((await request(t.app).get('/api/brands')).status).toBe(401);
  });

  it.each<Role>(['designer', 'engineer', 'brand_lead', 'toolmaker'])('when a %s creates a brand or a factory, then 403 and nothing is saved', async (role) => {
    const { auth } = await makeUser(role);
    const c = code();
    expect((await request(t.app).post('/api/brands').set(auth).send({ code: c, name: `Brand ${c}` })).status).toBe(403);
    expect((await request(t.app).post('/api/factories').set(auth).send({ name: `Factory ${c}`, city: 'X', country: 'Y' })).status).toBe(403);
    const { auth: admin } = await makeUser('admin');
    const list = await request(t.app).get('/api/brands').set(admin);
    expect(list.body.data.some((b: { code: string }) => b.code === c)).toBe(false);
  });

  it('when an admin creates a brand, then 201; the same code again is 409 on code', async () => {
    const { auth } = await makeUser('admin');
    const c = code();
    const res = await request(t.app).post('/api/brands').set(auth).send({ code: c.toLowerCase(), name: `Brand ${c}` });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code: c, name: `Brand ${c}` });
    const again = await request(t.app).post('/api/brands').set(auth).send({ code: c, name: `Other ${c}` });
    expect(again.status).toBe(409);
    expect(again.body.error.fieldErrors).toHaveProperty('code');
  });

  it('when a brand code is malformed, then 400 with a field error on code', async () => {
    const { auth } = await makeUser('admin');
    const res = await request(t.app).post('/api/brands').set(auth).send({ code: 'not a code!', name: 'Brand' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { code: expect.any(Array) } });
  });

  it('when an admin creates a factory without a city, then 400 on city; with one, then 201', async () => {
    const { auth } = await makeUser('admin');
    const name = `Factory ${uid()}`;
    const bad = await request(t.app).post('/api/factories').set(auth).send({ name, country: 'Nowhere' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('city');
    const good = await request(t.app).post('/api/factories').set(auth).send({ name, city: 'Testville', country: 'Nowhere', timeZone: 'Asia/Shanghai' });
    expect(good.status).toBe(201);
    expect(good.body).toMatchObject({ name, city: 'Testville', timeZone: 'Asia/Shanghai' });
  });
});
