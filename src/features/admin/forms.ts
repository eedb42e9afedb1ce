// Yup rules for the admin forms. They mirror shared/schemas/users.ts and organisation.ts (the
// server's zod schemas stay the authority); tests/web/admin-forms.test.ts compares verdicts.
// One deliberate difference: the time zone must be a zone this device knows (zod only limits length).
import * as yup from 'yup';
import { z } from 'zod';
import { roles, type Role } from '@shared/schemas/users';

const emailPattern = z.regexes.email;
const uuidPattern = z.regexes.uuid();

export function isTimeZone(tz: string): boolean {
  if (!tz || tz.length > 64) return false;
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

const timeZone = yup
  .string()
  .trim()
  .required('Enter a time zone, e.g. Asia/Shanghai')
  .test('tz', 'Not a time zone this device knows: use a name like Europe/London', (v) => !v || isTimeZone(v));

const name = yup.string().trim().required('Enter the full name').min(2, 'Enter the full name').max(120, 'Use at most 120 characters');

export const userFormSchema = yup.object({
  name,
  email: yup
    .string()
    .trim()
    .required('Enter the e-mail address')
    .max(320, 'Enter a valid e-mail address')
    .matches(emailPattern, 'Enter a valid e-mail address'),
  role: yup.mixed<Role>().oneOf(roles, 'Pick a role').required('Pick a role'),
  brandIds: yup.array(yup.string().required().matches(uuidPattern)).max(50, 'At most 50 brands').required(),
  factoryId: yup
    .string()
    .nullable()
    .defined()
    .when('role', {
      is: 'toolmaker',
      then: (s) => s.required('A toolmaker belongs to exactly one factory: pick it').matches(uuidPattern, 'Pick the factory'),
    }),
  timeZone,
});
export type UserFormValues = yup.InferType<typeof userFormSchema>;

/** The edit form has no e-mail (it cannot change). */
export const userEditFormSchema = userFormSchema.omit(['email']);
export type UserEditFormValues = yup.InferType<typeof userEditFormSchema>;

/** Values as the API wants them: only toolmakers send a factory. */
export function toUserPayload<T extends { role: Role; factoryId: string | null; brandIds: string[]; name: string; timeZone: string }>(v: T): T {
  return { ...v, name: v.name.trim(), timeZone: v.timeZone.trim(), factoryId: v.role === 'toolmaker' ? v.factoryId : null };
}

export const brandFormSchema = yup.object({
  code: yup
    .string()
    .trim()
    .required('Enter a short code, e.g. SR')
    .matches(/^[A-Za-z0-9]{2,6}$/, 'Use 2 to 6 letters or digits, e.g. SR'),
  name: yup.string().trim().required('Enter the brand name').min(2, 'Enter the brand name').max(120, 'Use at most 120 characters'),
});
export type BrandFormValues = yup.InferType<typeof brandFormSchema>;

export const factoryFormSchema = yup.object({
  name: yup.string().trim().required('Enter the factory name').min(2, 'Enter the factory name').max(120, 'Use at most 120 characters'),
  city: yup.string().trim().required('Enter the city').max(120, 'Use at most 120 characters'),
  country: yup.string().trim().required('Enter the country').min(2, 'Enter the country').max(80, 'Use at most 80 characters'),
  timeZone,
});
export type FactoryFormValues = yup.InferType<typeof factoryFormSchema>;
