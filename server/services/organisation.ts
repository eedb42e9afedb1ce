import type { Brand, Factory } from '../../shared/schemas/organisation';
import type { Actor } from '../lib/auth';
import { BrandModel, FactoryModel } from '../models';
import { recordAudit } from './audit';

const toBrand = (b: BrandModel): Brand => ({ id: b.id, code: b.code, name: b.name });
const toFactory = (f: FactoryModel): Factory => ({ id: f.id, name: f.name, city: f.city, country: f.country, timeZone: f.timeZone });

export const listBrands = async () => (await BrandModel.findAll({ order: [['name', 'ASC']] })).map(toBrand);
export const listFactories = async () => (await FactoryModel.findAll({ order: [['name', 'ASC']] })).map(toFactory);

export async function createBrand(actor: Actor, input: { code: string; name: string }) {
  const b = await BrandModel.create(input);
  await recordAudit(undefined, actor, 'brand.create', 'brand', b.id, null, toBrand(b));
  return toBrand(b);
}

export async function createFactory(actor: Actor, input: { name: string; city: string; country: string; timeZone: string }) {
  const f = await FactoryModel.create(input);
  await recordAudit(undefined, actor, 'factory.create', 'factory', f.id, null, toFactory(f));
  return toFactory(f);
}
