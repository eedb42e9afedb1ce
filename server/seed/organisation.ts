// Demo company: Kestrel Bay Toy Co. (invented), its brands, factories and one user per role.
import type { Language } from '../../shared/i18n';
import type { Transaction } from 'sequelize';
import { hashPassword } from '../lib/passwords';
import { BrandModel, FactoryModel, UserModel } from '../models';
import type { Role } from '../../shared/schemas/users';

export const DEMO_PASSWORD = 'toolgate-demo';

export const demoBrands = [
  { code: 'SR', name: 'Starling Rangers' },
  { code: 'MR', name: 'Mudlark Racers' },
];

export const demoFactories = [
  { name: 'Harbourline Plastics', city: 'Dongguan', country: 'China', timeZone: 'Asia/Shanghai' },
  { name: 'Pearl Delta Moldworks', city: 'Shenzhen', country: 'China', timeZone: 'Asia/Shanghai' },
];

export const demoUsers: { email: string; name: string; role: Role; timeZone: string; brands: string[]; factory?: string; language?: Language }[] = [
  { email: 'designer@kestrelbay.example', name: 'Wren Okafor', role: 'designer', timeZone: 'America/Los_Angeles', brands: ['SR', 'MR'] },
  { email: 'engineer@kestrelbay.example', name: 'Tomas Ilves', role: 'engineer', timeZone: 'America/Los_Angeles', brands: ['SR', 'MR'] },
  { email: 'brandlead@kestrelbay.example', name: 'Priya Halloran', role: 'brand_lead', timeZone: 'America/New_York', brands: ['SR'] },
  { email: 'toolmaker@harbourline.example', name: 'Chen Weiling', role: 'toolmaker', timeZone: 'Asia/Shanghai', brands: [], factory: 'Harbourline Plastics' },
  { email: 'admin@kestrelbay.example', name: 'Sam Dubois', role: 'admin', timeZone: 'UTC', brands: [] },
  { email: 'racerslead@kestrelbay.example', name: 'Marek Lindqvist', role: 'brand_lead', timeZone: 'Europe/London', brands: ['MR'] },
  { email: 'toolmaker@pearldelta.example', name: 'Lam Ka-yan', role: 'toolmaker', timeZone: 'Asia/Shanghai', brands: [], factory: 'Pearl Delta Moldworks' },
  // Reads Chinese first: screens and mail in simplified Chinese.
  { email: 'meilin@pearldelta.example', name: 'Huang Meilin', role: 'toolmaker', timeZone: 'Asia/Shanghai', brands: [], factory: 'Pearl Delta Moldworks', language: 'zh-Hans' },
];

/** Idempotent: finds by natural key, creates what is missing, leaves edited rows alone. */
export async function seedOrganisation(transaction: Transaction) {
  const brands = new Map<string, BrandModel>();
  for (const b of demoBrands) {
    const [row] = await BrandModel.findOrCreate({ where: { code: b.code }, defaults: b, transaction });
    brands.set(b.code, row);
  }
  const factories = new Map<string, FactoryModel>();
  for (const f of demoFactories) {
    const [row] = await FactoryModel.findOrCreate({ where: { name: f.name }, defaults: f, transaction });
    factories.set(f.name, row);
  }
  const hash = await hashPassword(DEMO_PASSWORD);
  const users = new Map<string, UserModel>();
  for (const u of demoUsers) {
    let row = await UserModel.findOne({ where: { email: u.email }, transaction });
    if (!row) {
      row = await UserModel.create(
        { email: u.email, name: u.name, role: u.role, timeZone: u.timeZone, language: u.language ?? 'en', passwordHash: hash, factoryId: u.factory ? factories.get(u.factory)!.id : null },
        { transaction },
      );
      await (row as unknown as { setBrands(ids: string[], o: object): Promise<void> }).setBrands(
        u.brands.map((c) => brands.get(c)!.id),
        { transaction },
      );
    }
    users.set(u.email, row);
  }
  return { brands, factories, users };
}
