import { Router, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { setPasswordInput, signInInput } from '../../shared/schemas/users';
import type { AppDeps } from '../app';
import { env } from '../env';
import { SESSION_COOKIE } from '../lib/auth';
import { AppError } from '../lib/errors';
import * as auth from '../services/auth';

const tooMany = () =>
  new AppError('rate_limited', 'Too many sign-in attempts. Wait 15 minutes and try again, or ask your administrator.', 429);

function setSessionCookie(res: Response, token: string) {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: env.PUBLIC_URL.startsWith('https:'),
    path: '/',
    maxAge: 12 * 3600 * 1000,
  });
}

export function authRouter(deps: AppDeps) {
  const r = Router();
  const window = 15 * 60_000;
  const perIp = rateLimit({
    windowMs: window,
    limit: deps.signInLimitPerIp ?? env.SIGN_IN_LIMIT_PER_IP,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(tooMany()),
  });
  const perEmail = rateLimit({
    windowMs: window,
    limit: deps.signInLimitPerEmail ?? env.SIGN_IN_LIMIT_PER_EMAIL,
    standardHeaders: false,
    legacyHeaders: false,
    keyGenerator: (req) => `email:${String((req.body as { email?: unknown })?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next) => next(tooMany()),
  });

  r.post('/sign-in', perIp, perEmail, async (req, res) => {
    const result = await auth.signIn(signInInput.parse(req.body));
    setSessionCookie(res, result.token);
    res.json(result);
  });

  r.post('/sign-out', (_req, res) => {
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  r.post('/set-password', perIp, async (req, res) => {
    const result = await auth.setPasswordFromInvitation(setPasswordInput.parse(req.body));
    setSessionCookie(res, result.token);
    res.json(result);
  });
  return r;
}
