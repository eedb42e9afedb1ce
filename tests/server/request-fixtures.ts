// A small invented scene for the change-request API tests, made fresh for each test:
// a head tool (brand A, factory F) molding "Head" and "Visor", and the products made from it:
//   kite     reissue_planned, needs Head + Visor at revision 1
//   deluxe   in_line,         needs Head
//   storm    in_line,         needs only Visor
//   heron    retired,         needs Head
// plus another tool of the same brand (with its own part) and users of every role.
import sharp from 'sharp';
import { ChangeRequestModel } from '../../server/models';
import type { RequestState } from '../../shared/domain/lifecycle';
import { makeBrand, makeFactory, makeUser, request, uid } from './helpers';
import { bind, makePart, makeProduct, makeTool } from './registry-helpers';
import type { openTestApp } from './helpers';

export async function makeScene() {
  const [brand, otherBrand, factory, otherFactory] = await Promise.all([makeBrand(), makeBrand(), makeFactory(), makeFactory()]);
  const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, name: `Kite head ${uid()}` });
  const head = await makePart(tool.id, 'Head', 2);
  const visor = await makePart(tool.id, 'Visor', 2);
  const otherTool = await makeTool({ brandId: brand.id, factoryId: factory.id });
  const otherPart = await makePart(otherTool.id, 'Torso', 2);

  const kite = await makeProduct(brand.id, { name: 'Kite', status: 'reissue_planned' });
  await kite.update({ plannedUnits: 40_000 });
  const deluxe = await makeProduct(brand.id, { name: 'Kite Deluxe', status: 'in_line' });
  const storm = await makeProduct(brand.id, { name: 'Storm Kite', status: 'in_line' });
  const heron = await makeProduct(brand.id, { name: 'Heron', status: 'retired' });
  const unrelated = await makeProduct(brand.id, { name: 'Unrelated' });
  await bind(kite.id, head, 1);
  await bind(kite.id, visor, 1);
  await bind(deluxe.id, head, 1);
  await bind(storm.id, visor, 1);
  await bind(heron.id, head, 1);
  await bind(unrelated.id, otherPart, 1);

  const [designer, otherDesigner, engineer, lead, otherLead, toolmaker, otherToolmaker, admin] = await Promise.all([
    makeUser('designer', { brandIds: [brand.id] }),
    makeUser('designer', { brandIds: [brand.id] }),
    makeUser('engineer'),
    makeUser('brand_lead', { brandIds: [brand.id] }),
    makeUser('brand_lead', { brandIds: [otherBrand.id] }),
    makeUser('toolmaker', { factoryId: factory.id }),
    makeUser('toolmaker', { factoryId: otherFactory.id }),
    makeUser('admin'),
  ]);
  return {
    brand,
    otherBrand,
    factory,
    tool,
    head,
    visor,
    otherTool,
    otherPart,
    products: { kite, deluxe, storm, heron, unrelated },
    users: { designer, otherDesigner, engineer, lead, otherLead, toolmaker, otherToolmaker, admin },
  };
}
export type Scene = Awaited<ReturnType<typeof makeScene>>;

/** Adds a raised ridge to the head: the part gains plastic, so steel is cut out (cannot be undone). */
export const ridgeItem = (partId: string, extra: Record<string, unknown> = {}) => ({
  partId,
  effect: 'gains_plastic',
  method: 'cut',
  size: '0.8',
  unit: 'mm',
  note: 'Raised ridge across the brow',
  safetyFlags: [],
  ...extra,
});

/** A replacement visor insert; the current one is kept (can be undone). */
export const insertItem = (partId: string, extra: Record<string, unknown> = {}) => ({
  partId,
  effect: 'insert_swapped',
  method: 'new_insert',
  size: '12.5',
  unit: 'mm',
  ...extra,
});

type App = ReturnType<typeof openTestApp>['app'];

export async function createDraft(app: App, s: Scene, body: Record<string, unknown> = {}) {
  const res = await request(app)
    .post('/api/requests')
    .set(s.users.designer.auth)
    .send({ toolId: s.tool.id, title: `Visor ridge ${uid()}`, reason: 'Derivative figure', items: [ridgeItem(s.head.id)], ...body });
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; version: number; items: { id: string }[] } & Record<string, unknown>;
}

/** Moves a request to a state directly (the lifecycle's own endpoint comes with the sign-off work). */
export async function putInState(id: string, status: RequestState) {
  await ChangeRequestModel.update({ status }, { where: { id } });
}

export const pngImage = (w = 64, h = 48, colour = '#0F766E') => sharp({ create: { width: w, height: h, channels: 3, background: colour } }).png().toBuffer();
export const jpegImage = () => sharp({ create: { width: 640, height: 480, channels: 3, background: '#8795A1' } }).jpeg({ quality: 90 }).toBuffer();

/** A photo-like JPEG (a busy pattern, about 200 KB), so a cut-off copy is really missing data. */
export async function photoJpeg() {
  const raw = Buffer.alloc(640 * 480 * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 7919 + (i >> 5) * 31) & 255;
  return sharp(raw, { raw: { width: 640, height: 480, channels: 3 } }).jpeg({ quality: 85 }).toBuffer();
}
