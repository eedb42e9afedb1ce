import { Router, type Request, type Response } from 'express';
import { changePasswordInput, setPasswordInput, signInInput } from '../../shared/schemas/users';
import type { AppDeps } from '../app';
import { env } from '../env';
import { SESSION_COOKIE, actorOf, requireAuth, tokenFrom } from '../lib/auth';
import { AppError } from '../lib/errors';
import { ttlSeconds, verifySessionToken } from '../lib/tokens';
import * as auth from '../services/auth';
import { readThrottle, recordFailure } from '../services/throttles';

export function setSessionCookie(res: Response, token: string) {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: env.PUBLIC_URL.startsWith('https:'),
    path: '/',
    maxAge: ttlSeconds(env.TOKEN_TTL) * 1000,
  });
}

const clientAddress = (req: Request) => req.ip ?? req.socket.remoteAddress ?? 'unknown';

export function authRouter(deps: AppDeps) {
  const r = Router();
  const policy = (): auth.SignInPolicy => ({
    sequelize: deps.sequelize,
    boss: deps.boss,
    perAccount: deps.signInLimitPerEmail ?? env.SIGN_IN_LIMIT_PER_EMAIL,
    perAddress: deps.signInLimitPerIp ?? env.SIGN_IN_LIMIT_PER_IP,
    delaySeconds: deps.signInDelaySeconds ?? 30,
    lockAfter: deps.signInLockAfter ?? env.SIGN_IN_LOCK_AFTER,
  });

  r.post('/sign-in', async (req, res) => {
    const result = await auth.signIn(signInInput.parse(req.body), clientAddress(req), policy());
    setSessionCookie(res, result.token);
    res.json(result);
  });

  // Ends the session on the server too: the token stops working everywhere at once.
  r.post('/sign-out', async (req, res) => {
    const token = tokenFrom(req);
    if (token) {
      const claims = await verifySessionToken(token).catch(() => null);
      if (claims) await auth.signOut(claims.sessionId);
    }
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  // Guessing invitation links counts against the address like wrong passwords do.
  r.post('/set-password', async (req, res) => {
    const ipKey = `set-password-ip:${clientAddress(req)}`;
    const limit = deps.signInLimitPerIp ?? env.SIGN_IN_LIMIT_PER_IP;
    const seen = await readThrottle(deps.sequelize, ipKey, 15 * 60_000);
    if (seen && seen.failures >= limit) throw new AppError('rate_limited', 'Too many tries from your network. Wait 15 minutes and try again, or ask your administrator.', 429);
    const input = setPasswordInput.parse(req.body);
    const result = await auth.setPasswordFromInvitation(input, deps.sequelize).catch(async (err: unknown) => {
      if (err instanceof AppError && err.status === 400) await recordFailure(deps.sequelize, ipKey, 15 * 60_000);
      throw err;
    });
    setSessionCookie(res, result.token);
    res.json(result);
  });

  // One's own password: every session of the account ends, this device gets a new one.
  r.post('/change-password', requireAuth, async (req, res) => {
    const result = await auth.changePassword(actorOf(res).id, changePasswordInput.parse(req.body));
    setSessionCookie(res, result.token);
    res.json(result);
  });
  return r;
}
