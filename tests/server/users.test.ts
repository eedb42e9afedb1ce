import { AuditEventModel, UserModel } from '../../server/models';
import type { Role } from '../../shared/schemas/users';
import { makeBrand, makeFactory, makeUser, openTestApp, request, uid } from './helpers';

const t = openTestApp();
afterAll(() => t.close());

const newEmail = (tag = 'new') => `${tag}-${uid()}@test.example`;

describe('admin creates users', () => {
  it('when an admin creates a designer with brands, then 201 with the user, a pending invitation and an audit entry', async () => {
    const { auth, user: admin } = await makeUser('admin');
    const brand = await makeBrand();
    const email = newEmail();
    const res = await request(t.app)
      .post('/api/users')
      .set(auth)
      .send({ email: `  ${email.toUpperCase()} `, name: 'Wren Calloway', role: 'designer', brandIds: [brand.id] });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, name: 'Wren Calloway', role: 'designer', active: true, factoryId: null, brandIds: [brand.id], invitationPending: true });
    const row = await UserModel.findByPk(res.body.id);
    expect(row?.passwordHash).toBeNull();
    const audit = await AuditEventModel.findOne({ where: { action: 'user.create', entityId: res.body.id } });
    expect(audit?.actorId).toBe(admin.id);
  });

  it('when the same brand is listed twice, then 201 with it once (not a 409 from the link table)', async () => {
    const { auth } = await makeUser('admin');
    const brand = await makeBrand();
    const res = await request(t.app).post('/api/users').set(auth).send({ email: newEmail(), name: 'Twice Listed', role: 'brand_lead', brandIds: [brand.id, brand.id] });
    expect(res.status).toBe(201);
    expect(res.body.brandIds).toEqual([brand.id]);
  });

  it('when a toolmaker is created with a factory, then 201 and the factory is kept', async () => {
    const { auth } = await makeUser('admin');
    const factory = await makeFactory();
    const res = await request(t.app).post('/api/users').set(auth).send({ email: newEmail('tm'), name: 'Ping Harrow', role: 'toolmaker', factoryId: factory.id });
    expect(res.status).toBe(201);
    expect(res.body.factoryId).toBe(factory.id);
  });

  it('when a toolmaker has no factory, then 400 with a field error on factoryId and nothing is saved', async () => {
    const { auth } = await makeUser('admin');
    const email = newEmail('tm');
    const res = await request(t.app).post('/api/users').set(auth).send({ email, name: 'Ping Harrow', role: 'toolmaker' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { factoryId: expect.any(Array) } });
    expect(await UserModel.count({ where: { email } })).toBe(0);
  });

  it('when the factory does not exist, then 400 with a field error on factoryId', async () => {
    const { auth } = await makeUser('admin');
    const res = await request(t.app)
      .post('/api/users')
      .set(auth)
      .send({ email: newEmail('tm'), name: 'Ping Harrow', role: 'toolmaker', factoryId: '00000000-0000-4000-8000-000000000000' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('factoryId');
  });

  it('when the e-mail and name are malformed, then 400 with field errors on both', async () => {
    const { auth } = await makeUser('admin');
    const res = await request(t.app).post('/api/users').set(auth).send({ email: 'not-an-email', name: ' ', role: 'engineer' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual(expect.objectContaining({ email: expect.any(Array), name: expect.any(Array) }));
  });

  it('when the e-mail is already used (in another letter case), then 409 conflict and the first user is unchanged', async () => {
    const { auth } = await makeUser('admin');
    const { user: existing } = await makeUser('engineer');
    const res = await request(t.app).post('/api/users').set(auth).send({ email: existing.email.toUpperCase(), name: 'Someone Else', role: 'designer' });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'conflict', fieldErrors: { email: expect.any(Array) } });
    const again = await UserModel.findByPk(existing.id);
    expect(again).toMatchObject({ name: existing.name, role: 'engineer' });
  });
});

describe('admin lists users', () => {
  it('when an admin lists with a search, then only matching users come back, sorted by name', async () => {
    const { auth } = await makeUser('admin');
    const tag = uid();
    await makeUser('engineer', { name: `Zed Quarry ${tag}` });
    await makeUser('designer', { name: `Abe Quarry ${tag}` });
    await makeUser('designer', { name: `Other Person ${uid()}` });
    const res = await request(t.app).get('/api/users').query({ search: `quarry ${tag}` }).set(auth);
    expect(res.status).toBe(200);
    expect(res.body.data.map((u: { name: string }) => u.name)).toEqual([`Abe Quarry ${tag}`, `Zed Quarry ${tag}`]);
  });

  it('when the search holds % or _, then they match literally, not as wildcards', async () => {
    const { auth } = await makeUser('admin');
    const tag = uid();
    await makeUser('engineer', { name: `Percent 100% ${tag}` });
    await makeUser('engineer', { name: `Percent 1000 ${tag}` });
    const res = await request(t.app).get('/api/users').query({ search: `100% ${tag}` }).set(auth);
    expect(res.body.data.map((u: { name: string }) => u.name)).toEqual([`Percent 100% ${tag}`]);
    const underscore = await request(t.app).get('/api/users').query({ search: `Percent 1_0` }).set(auth);
    expect(underscore.body.data.filter((u: { name: string }) => u.name.endsWith(tag))).toEqual([]);
  });

  it('when filtered by role, then every user has that role; an unknown role is 400', async () => {
    const { auth } = await makeUser('admin');
    await makeUser('brand_lead');
    const res = await request(t.app).get('/api/users').query({ role: 'brand_lead' }).set(auth);
    expect(res.status).toBe(200);
    expect(res.body.data.length).toBeGreaterThan(0);
    expect(new Set(res.body.data.map((u: { role: string }) => u.role))).toEqual(new Set(['brand_lead']));
    expect((await request(t.app).get('/api/users').query({ role: 'boss' }).set(auth)).status).toBe(400);
  });
});

describe('roles other than admin', () => {
  const others: Role[] = ['designer', 'engineer', 'brand_lead', 'toolmaker'];

  it.each(others)('when a user with role %s lists, creates or updates users, then 403 every time and nothing changes', async (role) => {
    const { auth } = await makeUser(role);
    const { user: target } = await makeUser('engineer');
    const email = newEmail('blocked');
    const list = await request(t.app).get('/api/users').set(auth);
    const create = await request(t.app).post('/api/users').set(auth).send({ email, name: 'Not Allowed', role: 'admin' });
    const update = await request(t.app).patch(`/api/users/${target.id}`).set(auth).send({ active: false });
    expect([list.status, create.status, update.status]).toEqual([403, 403, 403]);
    expect(create.body.error.code).toBe('forbidden');
    expect(await UserModel.count({ where: { email } })).toBe(0);
    expect((await UserModel.findByPk(target.id))?.active).toBe(true);
  });

  it('when nobody is signed in, then 401', async () => {
    expect((await request(t.app).get('/api/users')).status).toBe(401);
  });
});

describe('admin updates users', () => {
  it('when an admin renames a user and changes their brands, then 200 with the new values', async () => {
    const { auth } = await makeUser('admin');
    const [a, b] = [await makeBrand(), await makeBrand()];
    const { user } = await makeUser('brand_lead', { brandIds: [a.id] });
    const res = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ name: 'Juno Pell', brandIds: [b.id] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: user.id, name: 'Juno Pell', brandIds: [b.id] });
  });

  it('when a user is deactivated, then their token stops working at once', async () => {
    const { auth } = await makeUser('admin');
    const target = await makeUser('engineer');
    expect((await request(t.app).get('/api/me').set(target.auth)).status).toBe(200);
    const res = await request(t.app).patch(`/api/users/${target.user.id}`).set(auth).send({ active: false });
    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    expect((await request(t.app).get('/api/me').set(target.auth)).status).toBe(401);
  });

  it('when an admin tries to deactivate themself or drop their own admin role, then 400 and they stay an active admin', async () => {
    const { auth, user } = await makeUser('admin');
    const off = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ active: false });
    expect(off.status).toBe(400);
    expect(off.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { active: expect.any(Array) } });
    const demote = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ role: 'designer' });
    expect(demote.status).toBe(400);
    expect(await UserModel.findByPk(user.id)).toMatchObject({ active: true, role: 'admin' });
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(200);
  });

  it('when a designer becomes a toolmaker without a factory, then 400; with a factory, then 200', async () => {
    const { auth } = await makeUser('admin');
    const { user } = await makeUser('designer');
    const bad = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ role: 'toolmaker' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('factoryId');
    const factory = await makeFactory();
    const ok = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ role: 'toolmaker', factoryId: factory.id });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ role: 'toolmaker', factoryId: factory.id });
  });

  it('when a toolmaker becomes an engineer, then the factory is cleared', async () => {
    const { auth } = await makeUser('admin');
    const { user } = await makeUser('toolmaker');
    const res = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ role: 'engineer' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ role: 'engineer', factoryId: null });
  });

  it('when only a factory is sent for a designer, then 400 instead of dropping it silently', async () => {
    const { auth } = await makeUser('admin');
    const { user } = await makeUser('designer');
    const factory = await makeFactory();
    const res = await request(t.app).patch(`/api/users/${user.id}`).set(auth).send({ factoryId: factory.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('factoryId');
    expect((await UserModel.findByPk(user.id))?.factoryId).toBeNull();
  });

  it('when the id is not a uuid or not a user, then 404 either way (an id that is not a UUID names nothing)', async () => {
    const { auth } = await makeUser('admin');
    expect((await request(t.app).patch('/api/users/not-an-id').set(auth).send({ name: 'Any Name' })).status).toBe(404);
    expect((await request(t.app).patch('/api/users/00000000-0000-4000-8000-000000000000').set(auth).send({ name: 'Any Name' })).status).toBe(404);
  });
});
