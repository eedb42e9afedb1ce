import type { Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/schemas/users';
import { BrandModel, UserModel } from '../models';
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
}

function tokenFrom(req: Request): string | undefined {
  const h = req.get('authorization');
  if (h?.startsWith('Bearer ')) return h.slice(7).trim();
  const c = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  return c || undefined;
}

const unauthorized = (message = 'Sign in to continue') => new AppError('unauthorized', message, 401);

/** Every request re-reads the user, so a deactivated user's token stops working at once. */
export const requireAuth: RequestHandler = async (req, res, next) => {
  const token = tokenFrom(req);
  if (!token) throw unauthorized();
  let userId: string;
  try {
    userId = await verifySessionToken(token);
  } catch {
    throw unauthorized('Your session is not valid or has expired. Sign in again.');
  }
  const user = await UserModel.findByPk(userId, { include: [{ model: BrandModel, as: 'brands', attributes: ['id'], through: { attributes: [] } }] });
  if (!user || !user.active) throw unauthorized('This account is not active. Ask your administrator.');
  res.locals.user = {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    timeZone: user.timeZone,
    factoryId: user.factoryId,
    brandIds: (user.brands ?? []).map((b) => b.id),
  } satisfies Actor;
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
