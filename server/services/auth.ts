import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import type PgBoss from 'pg-boss';
import type { ChangePasswordInput, SessionUser, SetPasswordInput, SignInInput } from '../../shared/schemas/users';
import { env } from '../env';
import { enqueueEmail } from '../jobs/outbox';
import { AppError } from '../lib/errors';
import { decoyHash, hashPassword, verifyPassword } from '../lib/passwords';
import { endSession, signSessionToken } from '../lib/tokens';
import { unlockMail } from '../mail/templates/unlock';
import { UserModel } from '../models';
import { recordAudit } from './audit';
import { clearThrottle, lockThrottle, readThrottle, recordFailure } from './throttles';
import { sha256 } from './users';

const badCredentials = () => new AppError('unauthorized', 'Wrong e-mail or password', 401);

export interface SignInPolicy {
  sequelize: Sequelize;
  boss?: PgBoss;
  /** Wrong passwords for one account before each next try must wait `delaySeconds`. */
  perAccount: number;
  /** Wrong passwords from one address in 15 minutes before the address is refused. */
  perAddress: number;
  delaySeconds: number;
  /** Wrong passwords in a row after which the account locks until a new password is set by e-mail. */
  lockAfter: number;
}

const ADDRESS_WINDOW_MS = 15 * 60_000;
const ACCOUNT_WINDOW_MS = 24 * 3600_000;
const UNLOCK_LINK_DAYS = 1;
const accountKey = (email: string) => `sign-in:${email.trim().toLowerCase()}`;
const addressKey = (ip: string) => `sign-in-ip:${ip}`;

const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;

/**
 * Only wrong passwords count. An unknown e-mail, an invited account without a password and a
 * deactivated one all verify a password hash, so every answer takes the same time.
 */
export async function signIn(input: SignInInput, ip: string, policy: SignInPolicy): Promise<{ user: SessionUser; token: string }> {
  const { sequelize } = policy;
  const aKey = accountKey(input.email);
  const ipKey = addressKey(ip);
  const [address, account] = await Promise.all([readThrottle(sequelize, ipKey, ADDRESS_WINDOW_MS), readThrottle(sequelize, aKey, ACCOUNT_WINDOW_MS)]);
  if (address && address.failures >= policy.perAddress) {
    const waitMin = Math.max(1, Math.ceil((address.windowStartedAt.getTime() + ADDRESS_WINDOW_MS - Date.now()) / 60_000));
    throw new AppError('rate_limited', `Too many wrong passwords from your network. Wait ${plural(waitMin, 'minute')} and try again, or ask your administrator.`, 429);
  }
  if (account?.lockedAt) {
    throw new AppError(
      'rate_limited',
      'This account is locked after many wrong passwords. Open the link we sent to its e-mail address to choose a new password, or ask your administrator.',
      429,
    );
  }
  if (account && account.failures >= policy.perAccount) {
    const waitS = Math.ceil((account.lastFailureAt.getTime() + policy.delaySeconds * 1000 - Date.now()) / 1000);
    if (waitS > 0) throw new AppError('rate_limited', `Too many wrong passwords for this account. Wait ${plural(waitS, 'second')} and try again.`, 429, undefined, { retryAfterSeconds: waitS });
  }

  const user = await UserModel.findOne({ where: { email: input.email } });
  const ok = await verifyPassword(user?.passwordHash ?? (await decoyHash()), input.password);
  if (!user || !user.passwordHash || !ok) {
    await recordFailure(sequelize, ipKey, ADDRESS_WINDOW_MS);
    const failures = await recordFailure(sequelize, aKey, ACCOUNT_WINDOW_MS);
    if (failures >= policy.lockAfter) await lockAccount(policy, aKey, user);
    throw badCredentials();
  }
  // A deactivated user hears so only after a right password, so strangers learn nothing.
  if (!user.active) throw new AppError('unauthorized', 'This account is deactivated. Ask your administrator.', 401);
  if (account) await clearThrottle(sequelize, aKey);
  const token = await signSessionToken(user.id, user.role);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, token };
}

/** Locks the account and mails its owner a link to choose a new password (which lifts the lock). */
async function lockAccount(policy: SignInPolicy, key: string, user: UserModel | null) {
  await lockThrottle(policy.sequelize, key);
  if (!user || !user.active || !policy.boss) return;
  const token = randomBytes(32).toString('base64url');
  await policy.sequelize.transaction(async (transaction) => {
    user.inviteTokenHash = sha256(token);
    user.inviteExpiresAt = new Date(Date.now() + UNLOCK_LINK_DAYS * 86_400_000);
    await user.save({ transaction });
    await recordAudit(transaction, { id: user.id, name: user.name }, 'user.locked', 'user', user.id, null, null);
    const link = `${env.PUBLIC_URL}/set-password?token=${encodeURIComponent(token)}`;
    await enqueueEmail(policy.boss!, unlockMail({ to: user.email, name: user.name, link, days: UNLOCK_LINK_DAYS }), { sequelize: policy.sequelize, transaction });
  });
}

export async function signOut(sessionId: string) {
  await endSession(sessionId, 'signed_out');
}

/** Passwords are re-checked at the moment of an irreversible signature. */
export async function checkPassword(userId: string, password: string) {
  const user = await UserModel.findByPk(userId);
  return !!user && (await verifyPassword(user.passwordHash, password));
}

/** Ends every session of the user (a trigger does it when the hash changes) and opens a new one here. */
export async function changePassword(userId: string, input: ChangePasswordInput): Promise<{ user: SessionUser; token: string }> {
  const user = await UserModel.findByPk(userId);
  if (!user || !user.active) throw new AppError('unauthorized', 'Sign in again to continue.', 401);
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw new AppError('validation_failed', 'Your current password is not right. Enter it again.', 400, { currentPassword: ['The password is not right'] });
  }
  if (input.currentPassword === input.newPassword) {
    throw new AppError('validation_failed', 'Choose a new password that differs from the current one.', 400, { newPassword: ['Same as the current password'] });
  }
  user.passwordHash = await hashPassword(input.newPassword);
  await user.save();
  await recordAudit(undefined, { id: user.id, name: user.name }, 'user.change_password', 'user', user.id, null, null);
  const token = await signSessionToken(user.id, user.role);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, token };
}

export async function setPasswordFromInvitation(input: SetPasswordInput, sequelize?: Sequelize): Promise<{ user: SessionUser; token: string }> {
  const user = await UserModel.findOne({ where: { inviteTokenHash: sha256(input.token) } });
  if (!user || !user.inviteExpiresAt || user.inviteExpiresAt.getTime() < Date.now()) {
    throw new AppError('validation_failed', 'This invitation link is not valid or has expired. Ask your administrator for a new one.', 400, {
      token: ['Invalid or expired link'],
    });
  }
  if (!user.active) throw new AppError('unauthorized', 'This account is deactivated. Ask your administrator.', 401);
  user.passwordHash = await hashPassword(input.password);
  user.inviteTokenHash = null;
  user.inviteExpiresAt = null;
  await user.save();
  // A new password chosen by e-mail lifts a lock from wrong passwords.
  await clearThrottle(sequelize ?? UserModel.sequelize!, accountKey(user.email));
  await recordAudit(undefined, { id: user.id, name: user.name }, 'user.set_password', 'user', user.id, null, null);
  const token = await signSessionToken(user.id, user.role);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, token };
}
