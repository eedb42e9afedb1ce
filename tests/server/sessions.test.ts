import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { openTestApp, makeUser, request, PASSWORD } from './helpers';
import { UserModel } from '../../server/models';
import { BUILT_IN_JWT_SECRET, parseEnv, trustProxyValue } from '../../server/env';

// Counts argon2 verifications (passing each through) to show every kind of account does the hash work.
const argonVerifies: string[] = [];
jest.mock('@node-rs/argon2', () => {
  const real = jest.requireActual('@node-rs/argon2');
  return { ...real, verify: (h: string, p: string) => { argonVerifies.push(p); return real.verify(h, p); } };
});

const t = openTestApp();
afterAll(() => t.close());

const signIn = (app = t.app, email: string, password = PASSWORD, ip?: string) => {
  const r = request(app).post('/api/auth/sign-in');
  if (ip) r.set('X-Forwarded-For', ip);
  return r.send({ email, password });
};

describe('sessions end', () => {
  it('when a user signs out, then the same token no longer works as bearer or cookie', async () => {
    const { user } = await makeUser('engineer');
    const res = await signIn(t.app, user.email).expect(200);
    const token = res.body.token as string;
    await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`).expect(200);
    await request(t.app).post('/api/auth/sign-out').set('Cookie', `tg_session=${token}`).expect(204);
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
    expect((await request(t.app).get('/api/me').set('Cookie', `tg_session=${token}`)).status).toBe(401);
  });

  it('when the password is changed, then every old session ends and the new token works', async () => {
    const { user, auth } = await makeUser('designer');
    const other = (await signIn(t.app, user.email).expect(200)).body.token as string;
    const res = await request(t.app).post('/api/auth/change-password').set(auth).send({ currentPassword: PASSWORD, newPassword: 'a-brand-new-password' });
    expect(res.status).toBe(200);
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(401);
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${other}`)).status).toBe(401);
    await request(t.app).get('/api/me').set('Authorization', `Bearer ${res.body.token}`).expect(200);
    expect((await signIn(t.app, user.email)).status).toBe(401);
    await signIn(t.app, user.email, 'a-brand-new-password').expect(200);
  });

  it('when the current password given is wrong, then 400 on currentPassword and nothing changes', async () => {
    const { auth } = await makeUser('designer');
    const res = await request(t.app).post('/api/auth/change-password').set(auth).send({ currentPassword: 'not-it-at-all', newPassword: 'a-brand-new-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.currentPassword).toBeDefined();
    await request(t.app).get('/api/me').set(auth).expect(200);
  });

  it('when the role changes, then the old token stops working', async () => {
    const { user, auth } = await makeUser('designer');
    await UserModel.update({ role: 'engineer' }, { where: { id: user.id } });
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(401);
  });

  it('when a user is deactivated and reactivated, then the old token stays dead', async () => {
    const { user, auth } = await makeUser('engineer');
    await UserModel.update({ active: false }, { where: { id: user.id } });
    await UserModel.update({ active: true }, { where: { id: user.id } });
    expect((await request(t.app).get('/api/me').set(auth)).status).toBe(401);
  });
});

describe('sign-in limits count failures only', () => {
  it('when one account signs in rightly 15 times, then none is refused', async () => {
    const app = openTestApp({ signInLimitPerEmail: 10 }).app;
    const { user } = await makeUser('engineer');
    const codes: number[] = [];
    for (let i = 0; i < 15; i++) codes.push((await signIn(app, user.email)).status);
    expect(codes.every((c) => c === 200)).toBe(true);
  });

  it('when wrong passwords pass the account limit, then tries wait and the right password works after the wait', async () => {
    const { user } = await makeUser('designer');
    const waiting = openTestApp({ signInLimitPerEmail: 3, signInDelaySeconds: 600 }).app;
    for (let i = 0; i < 3; i++) expect((await signIn(waiting, user.email, 'wrong-wrong-wrong')).status).toBe(401);
    expect((await signIn(waiting, user.email)).status).toBe(429);
    // Same counters, no wait left: the right password gets in and clears the count.
    const after = openTestApp({ signInLimitPerEmail: 3, signInDelaySeconds: 0 }).app;
    await signIn(after, user.email).expect(200);
    expect((await signIn(waiting, user.email)).status).toBe(200);
  });

  it('when two servers share the database, then the account count is shared', async () => {
    const { user } = await makeUser('designer');
    const a = openTestApp({ signInLimitPerEmail: 4, signInDelaySeconds: 600 }).app;
    const b = openTestApp({ signInLimitPerEmail: 4, signInDelaySeconds: 600 }).app;
    for (let i = 0; i < 4; i++) await signIn(i % 2 ? a : b, user.email, 'wrong-wrong-wrong');
    expect((await signIn(a, user.email, 'wrong-wrong-wrong')).status).toBe(429);
    expect((await signIn(b, user.email, 'wrong-wrong-wrong')).status).toBe(429);
  });

  it('when many wrong passwords in a row, then the account locks until a new password is set from the e-mailed link', async () => {
    const { user } = await makeUser('engineer');
    const app = openTestApp({ signInLimitPerEmail: 100, signInDelaySeconds: 0, signInLockAfter: 3 }).app;
    for (let i = 0; i < 3; i++) await signIn(app, user.email, 'wrong-wrong-wrong');
    const locked = await signIn(app, user.email);
    expect(locked.status).toBe(429);
    expect(locked.body.error.message).toMatch(/locked/);
    // Without a queue no mail goes out; give the account a link as the lock mail would.
    const { sha256 } = await import('../../server/services/users');
    await UserModel.update({ inviteTokenHash: sha256('unlock-token-0123456789'), inviteExpiresAt: new Date(Date.now() + 3600_000) }, { where: { id: user.id } });
    await request(app).post('/api/auth/set-password').send({ token: 'unlock-token-0123456789', password: 'chosen-after-lock' }).expect(200);
    await signIn(app, user.email, 'chosen-after-lock').expect(200);
  });

  it('when wrong passwords come from one address behind the proxy, then that address is refused and another is not', async () => {
    const app = openTestApp({ signInLimitPerIp: 3, signInLimitPerEmail: 100 }).app;
    const { user } = await makeUser('designer');
    const ip = `198.51.100.${Math.floor(Math.random() * 250) + 1}`;
    for (let i = 0; i < 3; i++) await signIn(app, `nobody-${i}@test.example`, 'wrong-wrong-wrong', ip);
    expect((await signIn(app, user.email, PASSWORD, ip)).status).toBe(429);
    expect((await signIn(app, user.email, PASSWORD, '203.0.113.9')).status).toBe(200);
  });
});

describe('accounts not yet active', () => {
  it('when an invited account has no password yet, then sign-in verifies a hash like any other (same answer, hash work done)', async () => {
    const { user } = await makeUser('designer');
    await UserModel.update({ passwordHash: null }, { where: { id: user.id } });
    const res = await signIn(t.app, user.email, 'invited-account-try');
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe('Wrong e-mail or password');
    expect(argonVerifies).toContain('invited-account-try');
    await signIn(t.app, 'nobody-at-all@test.example', 'unknown-account-try').expect(401);
    expect(argonVerifies).toContain('unknown-account-try');
  });
});

describe('settings', () => {
  const root = path.resolve(__dirname, '..', '..');
  const start = (extra: Record<string, string>) =>
    spawnSync(process.execPath, ['--import', 'tsx', '-e', "require('./server/env')"], { cwd: root, env: { ...extra, PATH: process.env.PATH ?? "" } as unknown as NodeJS.ProcessEnv, encoding: 'utf8' });

  it('when production runs with the built-in secret, then the server refuses to start and names JWT_SECRET', () => {
    const r = start({ NODE_ENV: 'production' });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/JWT_SECRET/);
  });

  it('when the secret is short, then it refuses; when it is long and own, it starts', () => {
    expect(start({ NODE_ENV: 'production', JWT_SECRET: 'short' }).status).toBe(1);
    expect(start({ NODE_ENV: 'production', JWT_SECRET: 'x9'.repeat(24), RECORD_CHAIN_KEY: 'k7'.repeat(24) }).status).toBe(0);
    expect(parseEnv({ NODE_ENV: 'production', JWT_SECRET: BUILT_IN_JWT_SECRET }).env).toBeUndefined();
    expect(parseEnv({ NODE_ENV: 'development' }).env?.JWT_SECRET).toBe(BUILT_IN_JWT_SECRET);
  });

  it('when TRUST_PROXY is given, then Express gets a boolean, a hop count or addresses', () => {
    expect(trustProxyValue('false')).toBe(false);
    expect(trustProxyValue('2')).toBe(2);
    expect(trustProxyValue('10.0.0.0/8, loopback')).toBe('10.0.0.0/8, loopback');
  });
});
