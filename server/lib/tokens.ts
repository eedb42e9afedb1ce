// Session tokens: an HS256 JWT naming a session row in PostgreSQL. The signature keeps strangers
// out; the row lets a session end (sign-out, password or role change, deactivation) on every server.
import { randomUUID } from 'node:crypto';
import { SignJWT, jwtVerify } from 'jose';
import type { Transaction } from 'sequelize';
import { env } from '../env';
import { UserModel } from '../models';

const key = () => new TextEncoder().encode(env.JWT_SECRET);
const ISSUER = 'toolgate';
const UNIT_SECONDS = { s: 1, m: 60, h: 3600, d: 86400 } as const;

/** "12h" -> 43200; a leading minus (tests) gives an already expired session. */
export function ttlSeconds(ttl: string) {
  const m = /^(-?\d+)([smhd])$/.exec(ttl.trim());
  if (!m) throw new Error(`Session lifetime "${ttl}" is not like 12h`);
  return Number(m[1]) * UNIT_SECONDS[m[2] as keyof typeof UNIT_SECONDS];
}

const db = () => {
  const s = UserModel.sequelize;
  if (!s) throw new Error('models are not initialised');
  return s;
};

/** Opens a session for the user and returns its token. */
export async function signSessionToken(userId: string, role: string, ttl = env.TOKEN_TTL, transaction?: Transaction) {
  const sid = randomUUID();
  const seconds = ttlSeconds(ttl);
  await db().query(`INSERT INTO sessions (id, user_id, expires_at) VALUES ($1, $2, now() + make_interval(secs => $3))`, {
    bind: [sid, userId, seconds],
    transaction,
  });
  return new SignJWT({ role, sid })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(userId)
    .setIssuedAt()
    .setIssuer(ISSUER)
    .setAudience(ISSUER)
    .setExpirationTime(Math.floor(Date.now() / 1000) + seconds)
    .sign(key());
}

/** Throws on a bad signature, an expired token, another algorithm (including `none`) or other claims. */
export async function verifySessionToken(token: string): Promise<{ userId: string; sessionId: string }> {
  const { payload } = await jwtVerify(token, key(), { algorithms: ['HS256'], issuer: ISSUER, audience: ISSUER });
  if (typeof payload.sub !== 'string') throw new Error('token without subject');
  if (typeof payload.sid !== 'string') throw new Error('token without session');
  return { userId: payload.sub, sessionId: payload.sid };
}

export async function endSession(sessionId: string, reason: string) {
  await db().query(`UPDATE sessions SET ended_at = now(), ended_reason = $2 WHERE id = $1 AND ended_at IS NULL`, { bind: [sessionId, reason] });
}

export async function endAllSessions(userId: string, reason: string, transaction?: Transaction) {
  await db().query(`UPDATE sessions SET ended_at = now(), ended_reason = $2 WHERE user_id = $1 AND ended_at IS NULL`, { bind: [userId, reason], transaction });
}
