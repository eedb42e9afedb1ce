import { SignJWT, jwtVerify } from 'jose';
import { env } from '../env';

const key = () => new TextEncoder().encode(env.JWT_SECRET);
const ISSUER = 'toolgate';

export async function signSessionToken(userId: string, role: string, ttl = env.TOKEN_TTL) {
  return new SignJWT({ role })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(userId)
    .setIssuedAt()
    .setIssuer(ISSUER)
    .setAudience(ISSUER)
    .setExpirationTime(ttl)
    .sign(key());
}

/** Throws on a bad signature, an expired token, another algorithm (including `none`) or other claims. */
export async function verifySessionToken(token: string) {
  const { payload } = await jwtVerify(token, key(), { algorithms: ['HS256'], issuer: ISSUER, audience: ISSUER });
  if (typeof payload.sub !== 'string') throw new Error('token without subject');
  return payload.sub;
}
