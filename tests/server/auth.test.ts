import { SignJWT } from 'jose';
import { openTestApp, makeUser, request, PASSWORD } from './helpers';
import { signSessionToken } from '../../server/lib/tokens';
import { UserModel } from '../../server/models';

const t = openTestApp();
afterAll(() => t.close());

describe('sign-in', () => {
  it('when the password is right, then 200 with the user, a token and an httpOnly cookie', async () => {
    const { user } = await makeUser('engineer');
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email.toUpperCase(), password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: user.id, email: user.email, name: user.name, role: 'engineer' });
    expect(typeof res.body.token).toBe('string');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/tg_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('when the password is wrong or the e-mail unknown, then the same 401 message', async () => {
    const { user } = await makeUser('designer');
    const wrong = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'nope-nope-nope' });
    const unknown = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: 'nope-nope-nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('when the e-mail is malformed, then 400 with a field error on email', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'not-an-email', password: 'x' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { email: expect.any(Array) } });
  });

  it('when the body is not JSON, then 400 bad_json with a clear message and no stack', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('content-type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/);
  });

  it('when the cookie from sign-in is sent back, then /api/me answers', async () => {
    const { user } = await makeUser('brand_lead');
    const agent = request.agent(t.app);
    await agent.post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD }).expect(200);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ id: user.id, role: 'brand_lead' });
    await agent.post('/api/auth/sign-out').expect(204);
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('when too many attempts for one e-mail, then 429', async () => {
    const limited = openTestApp({ signInLimitPerEmail: 3 });
    const { user } = await makeUser('designer');
    for (let i = 0; i < 3; i++) await request(limited.app).post('/api/auth/sign-in').send({ email: user.email, password: 'wrong-wrong' });
    const res = await request(limited.app).post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('rate_limited');
  });
});

describe('tokens', () => {
  it('when there is no token, then 401', async () => {
    expect((await request(t.app).get('/api/me')).status).toBe(401);
  });

  it('when the token is tampered, then 401', async () => {
    const { token } = await makeUser('designer');
    const [h, p, s] = token.split('.');
    const payload = JSON.parse(Buffer.from(p!, 'base64url').toString());
    payload.role = 'admin';
    const forged = `${h}.${Buffer.from(JSON.stringify(payload)).toString('base64url')}.${s}`;
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${forged}`)).status).toBe(401);
  });

  it('when the token is expired, then 401', async () => {
    const { user } = await makeUser('designer');
    const token = await signSessionToken(user.id, user.role, '-1s');
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
  });

  it('when the token uses alg none, then 401', async () => {
    const { user } = await makeUser('admin');
    const header = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const body = Buffer.from(JSON.stringify({ sub: user.id, iss: 'toolgate', aud: 'toolgate', exp: Math.floor(Date.now() / 1000) + 600 })).toString('base64url');
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${header}.${body}.`)).status).toBe(401);
  });

  it('when the token is signed with another key, then 401', async () => {
    const { user } = await makeUser('admin');
    const token = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject(user.id).setIssuer('toolgate').setAudience('toolgate').setExpirationTime('1h').sign(new TextEncoder().encode('x'.repeat(40)));
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
  });

  it('when the user is deactivated, then the token stops working and sign-in is refused', async () => {
    const { user, auth } = await makeUser('engineer');
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(200);
    await UserModel.update({ active: false }, { where: { id: user.id } });
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(401);
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(401);
  });
});
