import { z } from 'zod';
import { languages } from '../i18n';

export const roles = ['designer', 'engineer', 'brand_lead', 'toolmaker', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  designer: 'Designer',
  engineer: 'Tooling engineer',
  brand_lead: 'Brand lead',
  toolmaker: 'Toolmaker',
  admin: 'Administrator',
};

export const sessionUserSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const userSchema = sessionUserSchema.extend({
  active: z.boolean(),
  timeZone: z.string(),
  /** Screens, mail and error messages: 'en' or 'zh-Hans'. */
  language: z.enum(languages),
  factoryId: z.string().uuid().nullable(),
  brandIds: z.array(z.string().uuid()),
  invitationPending: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const meSchema = userSchema.extend({
  factoryName: z.string().nullable(),
  brandNames: z.array(z.string()),
});
export type Me = z.infer<typeof meSchema>;

export const setLanguageInput = z.object({ language: z.enum(languages, { message: 'Pick English or 简体中文' }) });
export type SetLanguageInput = z.infer<typeof setLanguageInput>;

export const signInInput = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address' }).max(320)),
  password: z.string().min(1, { message: 'Enter your password' }).max(200),
});
export type SignInInput = z.infer<typeof signInInput>;

export const signInResult = z.object({ user: sessionUserSchema, token: z.string() });
export type SignInResult = z.infer<typeof signInResult>;

export const passwordRule = z
  .string()
  .min(10, { message: 'Use at least 10 characters' })
  .max(200, { message: 'Use at most 200 characters' });

export const setPasswordInput = z.object({ token: z.string().min(10), password: passwordRule });
export type SetPasswordInput = z.infer<typeof setPasswordInput>;

/** Changing one's own password ends every other session of that account. */
export const changePasswordInput = z.object({ currentPassword: z.string().min(1, 'Enter your current password').max(200), newPassword: passwordRule });
export type ChangePasswordInput = z.infer<typeof changePasswordInput>;

const userFields = {
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address' }).max(320)),
  name: z.string().trim().min(2, { message: 'Enter the full name' }).max(120),
  role: roleSchema,
  timeZone: z.string().min(1).max(64).default('UTC'),
  factoryId: z.string().uuid().nullable().default(null),
  brandIds: z.array(z.string().uuid()).max(50).default([]),
};

function checkFactoryRule<T extends { role?: Role; factoryId?: string | null }>(v: T, ctx: z.RefinementCtx) {
  if (v.role === 'toolmaker' && !v.factoryId) {
    ctx.addIssue({ code: 'custom', path: ['factoryId'], message: 'A toolmaker belongs to exactly one factory: pick it' });
  }
  if (v.role && v.role !== 'toolmaker' && v.factoryId) {
    ctx.addIssue({ code: 'custom', path: ['factoryId'], message: 'Only toolmakers belong to a factory' });
  }
}

export const createUserInput = z.object(userFields).superRefine(checkFactoryRule);
export type CreateUserInput = z.input<typeof createUserInput>;

export const updateUserInput = z
  .object({
    name: userFields.name,
    role: roleSchema,
    timeZone: z.string().min(1).max(64),
    factoryId: z.string().uuid().nullable(),
    brandIds: z.array(z.string().uuid()).max(50),
    active: z.boolean(),
  })
  .partial()
  .superRefine(checkFactoryRule);
export type UpdateUserInput = z.infer<typeof updateUserInput>;
