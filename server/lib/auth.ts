import type { Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/schemas/users';
import { QueryTypes } from 'sequelize';
import { UserModel } from '../models';
import { AppError, forbidden } from './errors';
import { verifySessionToken } from './tokens';

export const SESSION_COOKIE = 'tg_session';

/** The signed-in user as every route sees it (res.locals.user). */
export interface Actor {
  id: string;
  email: string;
  name: string;
  role: Role;
  timeZone: string;
  factoryId: string | null;
  brandIds: string[];
  /** Screens, mail and error messages for this user: 'en' or 'zh-Hans'. */
  language?: string;
  /** The session this request came with (sign-out and password change end it). */
  sessionId?: string;
}

export function tokenFrom(req: Request): string | undefined {
  const h = req.get('authorization');
  if (h?.startsWith('Bearer ')) return h.slice(7).trim();
  const c = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  return c || undefined;
}

const unauthorized = (message = 'Sign in to continue') => new AppError('unauthorized', message, 401);

// One query per request: the session must be open and unexpired, and its user active.
const SESSION_SQL = `
  SELECT u.id, u.email, u.name, u.role, u.time_zone AS "timeZone", u.factory_id AS "factoryId", u.active, u.language,
         ARRAY(SELECT ub.brand_id FROM user_brands ub WHERE ub.user_id = u.id) AS "brandIds"
  FROM sessions s JOIN users u ON u.id = s.user_id
  WHERE s.id = $1 AND s.user_id = $2 AND s.ended_at IS NULL AND s.expires_at > now()`;

type SessionRow = Omit<Actor, 'sessionId'> & { active: boolean };

/** Every request checks its session in PostgreSQL, so an ended session stops working at once. */
export const requireAuth: RequestHandler = async (req, res, next) => {
  const token = tokenFrom(req);
  if (!token) throw unauthorized();
  let claims: { userId: string; sessionId: string };
  try {
    claims = await verifySessionToken(token);
  } catch {
    throw unauthorized('Your session is not valid or has expired. Sign in again.');
  }
  const rows = await UserModel.sequelize!.query<SessionRow>(SESSION_SQL, { bind: [claims.sessionId, claims.userId], type: QueryTypes.SELECT });
  const row = rows[0];
  if (!row) throw unauthorized('Your session has ended. Sign in again.');
  if (!row.active) throw unauthorized('This account is not active. Ask your administrator.');
  const { active: _active, ...actor } = row;
  res.locals.user = { ...actor, sessionId: claims.sessionId } satisfies Actor;
  next();
};

export const requireRole =
  (...allowed: Role[]): RequestHandler =>
  (_req, res, next) => {
    const actor = res.locals.user as Actor | undefined;
    if (!actor) throw unauthorized();
    if (!allowed.includes(actor.role)) throw forbidden(`This needs one of these roles: ${allowed.join(', ')}`);
    next();
  };

export const actorOf = (res: Response): Actor => {
  const a = res.locals.user as Actor | undefined;
  if (!a) throw unauthorized();
  return a;
};
