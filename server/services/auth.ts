import type { SessionUser, SetPasswordInput, SignInInput } from '../../shared/schemas/users';
import { AppError } from '../lib/errors';
import { decoyHash, hashPassword, verifyPassword } from '../lib/passwords';
import { signSessionToken } from '../lib/tokens';
import { UserModel } from '../models';
import { recordAudit } from './audit';
import { sha256 } from './users';

const badCredentials = () => new AppError('unauthorized', 'Wrong e-mail or password', 401);

export async function signIn(input: SignInInput): Promise<{ user: SessionUser; token: string }> {
  const user = await UserModel.findOne({ where: { email: input.email } });
  if (!user) {
    await verifyPassword(await decoyHash(), input.password);
    throw badCredentials();
  }
  const ok = await verifyPassword(user.passwordHash, input.password);
  // A deactivated user gets the same answer as a wrong password only after a correct one,
  // so the message can say what to do without telling strangers the account exists.
  if (!ok) throw badCredentials();
  if (!user.active) throw new AppError('unauthorized', 'This account is deactivated. Ask your administrator.', 401);
  const token = await signSessionToken(user.id, user.role);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, token };
}

/** Passwords are re-checked at the moment of an irreversible signature. */
export async function checkPassword(userId: string, password: string) {
  const user = await UserModel.findByPk(userId);
  return !!user && (await verifyPassword(user.passwordHash, password));
}

export async function setPasswordFromInvitation(input: SetPasswordInput): Promise<{ user: SessionUser; token: string }> {
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
  await recordAudit(undefined, { id: user.id, name: user.name }, 'user.set_password', 'user', user.id, null, null);
  const token = await signSessionToken(user.id, user.role);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, token };
}
