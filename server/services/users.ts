import { createHash, randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { isLanguage, type Language } from '../../shared/i18n';
import type { CreateUserInput, Me, UpdateUserInput, User } from '../../shared/schemas/users';
import { createUserInput } from '../../shared/schemas/users';
import type { AppDeps } from '../app';
import { env } from '../env';
import { enqueueEmail } from '../jobs/outbox';
import type { Actor } from '../lib/auth';
import { AppError, notFound } from '../lib/errors';
import { BrandModel, FactoryModel, UserModel } from '../models';
import { recordAudit } from './audit';
import { invitationMail } from '../mail/templates/invitation';

const INVITE_DAYS = 7;
const withBrands = [{ model: BrandModel, as: 'brands', attributes: ['id', 'name'], through: { attributes: [] } }];

/** A brand listed twice is one assignment, not a clash in user_brands. */
const unique = (ids: string[]) => [...new Set(ids)];

export const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

export function toUserDto(u: UserModel): User {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active,
    timeZone: u.timeZone,
    language: isLanguage(u.language) ? u.language : 'en',
    factoryId: u.factoryId,
    brandIds: (u.brands ?? []).map((b) => b.id),
    invitationPending: !u.passwordHash && !!u.inviteTokenHash,
    createdAt: u.createdAt.toISOString(),
  };
}

export async function getMe(id: string): Promise<Me> {
  const u = await UserModel.findByPk(id, { include: [...withBrands, { model: FactoryModel, as: 'factory' }] });
  if (!u) throw notFound('User');
  return { ...toUserDto(u), factoryName: u.factory?.name ?? null, brandNames: (u.brands ?? []).map((b) => b.name) };
}

/** The caller's own language for screens and mail. */
export async function setMyLanguage(actor: Actor, language: Language): Promise<Me> {
  await UserModel.sequelize!.transaction(async (transaction) => {
    const u = (await UserModel.findByPk(actor.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const before = { language: u.language };
    u.language = language;
    await u.save({ transaction });
    await recordAudit(transaction, actor, 'user.language', 'user', u.id, before, { language });
  });
  return getMe(actor.id);
}

export async function listUsers(q: { search?: string; role?: string }): Promise<User[]> {
  const where: Record<string | symbol, unknown> = {};
  if (q.role) where.role = q.role;
  if (q.search) {
    // The search text is matched literally: % and _ are not wildcards here.
    const pattern = `%${q.search.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where[Op.or] = [{ email: { [Op.iLike]: pattern } }, { name: { [Op.iLike]: pattern } }];
  }
  const rows = await UserModel.findAll({ where, include: withBrands, order: [['name', 'ASC']] });
  return rows.map(toUserDto);
}

async function checkRefs(brandIds: string[] | undefined, factoryId: string | null | undefined) {
  if (brandIds?.length) {
    const found = await BrandModel.count({ where: { id: brandIds } });
    if (found !== new Set(brandIds).size) throw new AppError('validation_failed', 'One of the brands does not exist', 400, { brandIds: ['Unknown brand'] });
  }
  if (factoryId && !(await FactoryModel.findByPk(factoryId))) {
    throw new AppError('validation_failed', 'That factory does not exist', 400, { factoryId: ['Unknown factory'] });
  }
}

/** Creates the user without a password and queues an invitation with a set-password link, in one transaction. */
export async function createUser(deps: AppDeps, actor: Actor, raw: CreateUserInput): Promise<User> {
  const input = createUserInput.parse(raw);
  await checkRefs(input.brandIds, input.factoryId);
  if (await UserModel.findOne({ where: { email: input.email } })) {
    throw new AppError('conflict', 'A user with that e-mail already exists', 409, { email: ['Already in use'] });
  }
  const token = randomBytes(32).toString('base64url');
  const user = await deps.sequelize.transaction(async (transaction) => {
    const u = await UserModel.create(
      {
        email: input.email,
        name: input.name,
        role: input.role,
        timeZone: input.timeZone,
        factoryId: input.role === 'toolmaker' ? input.factoryId : null,
        passwordHash: null,
        inviteTokenHash: sha256(token),
        inviteExpiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000),
      },
      { transaction },
    );
    await (u as unknown as { setBrands(ids: string[], o: object): Promise<void> }).setBrands(unique(input.brandIds), { transaction });
    await recordAudit(transaction, actor, 'user.create', 'user', u.id, null, { email: u.email, role: u.role, brandIds: unique(input.brandIds), factoryId: u.factoryId });
    if (deps.boss) {
      const link = `${env.PUBLIC_URL}/set-password?token=${encodeURIComponent(token)}`;
      await enqueueEmail(deps.boss, invitationMail({ to: u.email, name: u.name, role: u.role, invitedBy: actor.name, link, days: INVITE_DAYS }), {
        sequelize: deps.sequelize,
        transaction,
      });
    }
    return u;
  });
  await user.reload({ include: withBrands });
  return toUserDto(user);
}

export async function updateUser(deps: AppDeps, actor: Actor, id: string, input: UpdateUserInput): Promise<User> {
  const user = await UserModel.findByPk(id, { include: withBrands });
  if (!user) throw notFound('User');
  if (id === actor.id && (input.active === false || (input.role && input.role !== 'admin'))) {
    throw new AppError('validation_failed', 'You cannot deactivate yourself or remove your own administrator role', 400, {
      ...(input.active === false && { active: ['Another administrator must do this'] }),
      ...(input.role && input.role !== 'admin' && { role: ['Another administrator must do this'] }),
    });
  }
  const role = input.role ?? user.role;
  const factoryId = input.factoryId !== undefined ? input.factoryId : user.factoryId;
  if (role === 'toolmaker' && !factoryId) throw new AppError('validation_failed', 'A toolmaker needs a factory', 400, { factoryId: ['Pick the factory'] });
  // A factory sent for someone who stays (or becomes) a non-toolmaker would otherwise be dropped silently.
  if (role !== 'toolmaker' && input.factoryId) {
    throw new AppError('validation_failed', 'Only toolmakers belong to a factory', 400, { factoryId: ['Only toolmakers belong to a factory'] });
  }
  await checkRefs(input.brandIds, factoryId);
  const before = toUserDto(user);
  await deps.sequelize.transaction(async (transaction) => {
    user.set({
      ...(input.name !== undefined && { name: input.name }),
      ...(input.timeZone !== undefined && { timeZone: input.timeZone }),
      ...(input.active !== undefined && { active: input.active }),
      role,
      factoryId: role === 'toolmaker' ? factoryId : null,
    });
    await user.save({ transaction });
    if (input.brandIds) await (user as unknown as { setBrands(ids: string[], o: object): Promise<void> }).setBrands(unique(input.brandIds), { transaction });
    await user.reload({ include: withBrands, transaction });
    await recordAudit(transaction, actor, 'user.update', 'user', user.id, before, toUserDto(user));
  });
  return toUserDto(user);
}
