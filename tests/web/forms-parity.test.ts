// Yup (client UX rules) and zod (server authority) must give the same verdict on the same input.
import { createBrandInput, createFactoryInput } from '@shared/schemas/organisation';
import { createUserInput, passwordRule, signInInput } from '@shared/schemas/users';
import { brandFormSchema, factoryFormSchema, userFormSchema } from '@/features/admin/forms';
import { setPasswordFormSchema, signInFormSchema } from '@/features/auth/forms';

const yupOk = (schema: { isValidSync: (v: unknown) => boolean }, v: unknown) => schema.isValidSync(v);
const zodOk = (schema: { safeParse: (v: unknown) => { success: boolean } }, v: unknown) => schema.safeParse(v).success;

const BRAND = '7d8a3f0e-2b5c-4c1a-9e3f-0a1b2c3d4e5f';
const FACTORY = '0f1e2d3c-4b5a-4697-8887-a6b5c4d3e2f1';

describe('sign-in form rules', () => {
  const cases: [string, { email: string; password: string }][] = [
    ['a plain address', { email: 'designer@kestrelbay.example', password: 'x' }],
    ['spaces around the address', { email: '  Engineer@KestrelBay.example ', password: 'x' }],
    ['no domain dot', { email: 'a@b', password: 'x' }],
    ['no at sign', { email: 'designer.kestrelbay.example', password: 'x' }],
    ['empty password', { email: 'designer@kestrelbay.example', password: '' }],
    ['empty address', { email: '', password: 'toolgate-demo' }],
    ['a 201-character password', { email: 'a@b.co', password: 'p'.repeat(201) }],
    ['a plus address', { email: 'wren+tools@kestrelbay.example', password: 'p' }],
    ['two dots in a row', { email: 'wren..o@kestrelbay.example', password: 'p' }],
  ];
  it.each(cases)('when the input has %s, then yup and zod agree', (_name, input) => {
    expect(yupOk(signInFormSchema, input)).toBe(zodOk(signInInput, input));
  });
});

describe('set-password form rules', () => {
  it.each([
    ['9 characters', 'x'.repeat(9)],
    ['10 characters', 'x'.repeat(10)],
    ['200 characters', 'x'.repeat(200)],
    ['201 characters', 'x'.repeat(201)],
    ['nothing', ''],
  ])('when the password has %s, then yup and zod agree', (_n, password) => {
    expect(yupOk(setPasswordFormSchema, { password, confirm: password })).toBe(zodOk(passwordRule, password));
  });

  it('when the two passwords differ, then the form refuses', () => {
    expect(yupOk(setPasswordFormSchema, { password: 'long enough 1', confirm: 'long enough 2' })).toBe(false);
  });
});

describe('user form rules', () => {
  const base = { name: 'Ada Quill', email: 'ada@kestrelbay.example', role: 'designer', brandIds: [BRAND], factoryId: null, timeZone: 'Europe/London' };
  it.each<[string, Record<string, unknown>]>([
    ['a valid designer', {}],
    ['a toolmaker with a factory', { role: 'toolmaker', brandIds: [], factoryId: FACTORY }],
    ['a toolmaker without a factory', { role: 'toolmaker', brandIds: [], factoryId: null }],
    ['a one-letter name', { name: 'A' }],
    ['a bad e-mail', { email: 'ada@' }],
    ['an unknown role', { role: 'owner' }],
    ['a brand id that is not a uuid', { brandIds: ['SR'] }],
    ['no brands', { brandIds: [] }],
  ])('when the form holds %s, then yup and zod agree', (_n, change) => {
    const v = { ...base, ...change };
    expect(yupOk(userFormSchema, v)).toBe(zodOk(createUserInput, v));
  });

  it('when the time zone is not a real zone, then yup refuses though zod only checks length (stricter on purpose)', () => {
    const v = { ...base, timeZone: 'Mars/Olympus' };
    expect(yupOk(userFormSchema, v)).toBe(false);
    expect(zodOk(createUserInput, v)).toBe(true);
  });
});

describe('brand and factory form rules', () => {
  it.each([
    ['SR', 'Starling Rangers'],
    ['sr', 'Starling Rangers'],
    ['S', 'Starling Rangers'],
    ['SRANGER', 'Starling Rangers'],
    ['S-R', 'Starling Rangers'],
    ['MR2', 'M'],
    ['MR2', ''],
  ])('when the brand is code %p name %p, then yup and zod agree', (code, name) => {
    expect(yupOk(brandFormSchema, { code, name })).toBe(zodOk(createBrandInput, { code, name }));
  });

  it.each<[string, Record<string, string>]>([
    ['a full factory', { name: 'Harbourline Plastics', city: 'Dongguan', country: 'China', timeZone: 'Asia/Shanghai' }],
    ['no city', { name: 'Harbourline Plastics', city: '', country: 'China', timeZone: 'Asia/Shanghai' }],
    ['a one-letter country', { name: 'Harbourline Plastics', city: 'Dongguan', country: 'C', timeZone: 'Asia/Shanghai' }],
    ['a one-letter name', { name: 'H', city: 'Dongguan', country: 'China', timeZone: 'Asia/Shanghai' }],
  ])('when the factory form holds %s, then yup and zod agree', (_n, v) => {
    expect(yupOk(factoryFormSchema, v)).toBe(zodOk(createFactoryInput, v));
  });
});
