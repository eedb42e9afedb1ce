// Property-based: every write route, sent bodies built from a valid one with fields replaced by
// hostile values (NUL, half emoji, far dates, huge or fractional numbers, wrong types, long text),
// or an arbitrary JSON value, answers with a 2xx or a 4xx, never a 5xx. Bounded in runs per route.
import fc from 'fast-check';
import type { ZodType } from 'zod';
import { createBrandInput, createFactoryInput } from '../../shared/schemas/organisation';
import { createRequestInput, updateRequestInput } from '../../shared/schemas/change-requests';
import { saveNumbersInput } from '../../shared/schemas/numbers';
import {
  createBillEntryInput,
  createPartInput,
  createProductInput,
  createToolInput,
  retentionDecisionInput,
  updateBillEntryInput,
  updatePartInput,
  updateProductInput,
  updateToolInput,
} from '../../shared/schemas/registry';
import { takeActionInput } from '../../shared/schemas/request-actions';
import { createUserInput, signInInput, updateUserInput } from '../../shared/schemas/users';
import { BillOfPartsModel } from '../../server/models';
import { openTestApp, request, uid } from './helpers';
import { code } from './registry-helpers';
import { createDraft, makeScene, ridgeItem, type Scene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

const RUNS = 25;

const hostile = fc.oneof(
  fc.constantFrom(
    '\u0000',
    'Ridge\u0000cut',
    '\uD83D',
    'half \uDE00 emoji',
    '9999-12-31',
    '0000-01-01',
    '2027-02-31',
    '1899-12-31',
    '-1',
    '1e309',
    '',
    '   ',
    '=SUM(A1:A9)',
    "'; DROP TABLE tools; --",
    'A'.repeat(5000),
    '😀'.repeat(300),
  ),
  fc.string({ maxLength: 30 }),
  fc.string({ unit: 'binary', maxLength: 30 }),
  fc.integer(),
  fc.double(),
  fc.constantFrom(Number.MAX_SAFE_INTEGER + 2, 1e21, 0.001, 0.005, -0.0, 2 ** 31, -(2 ** 63), 1e308),
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.oneof(fc.string({ maxLength: 8 }), fc.integer()), { maxLength: 3 }),
  fc.dictionary(fc.string({ maxLength: 6 }), fc.oneof(fc.string({ maxLength: 6 }), fc.integer()), { maxKeys: 3 }),
);

const keysOf = (schema: ZodType) => Object.keys((schema as unknown as { shape?: Record<string, unknown> }).shape ?? {});

/** A body: the valid one with some of its (or its schema's) fields replaced, or any JSON at all. */
function bodies(base: Record<string, unknown>, schema?: ZodType) {
  const keys = [...new Set([...Object.keys(base), ...(schema ? keysOf(schema) : [])])];
  return fc.oneof(
    { weight: 4, arbitrary: fc.dictionary(fc.constantFrom(...keys), hostile, { minKeys: 1, maxKeys: 3 }).map((o) => ({ ...base, ...o })) },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
  );
}

/** schema: the route's input schema, whose keys are mutated too (left out where the base names them all). */
type Route = { name: string; method: 'post' | 'patch' | 'put'; path: string; auth: Record<string, string>; base: Record<string, unknown>; schema?: ZodType };

async function routes(s: Scene): Promise<Route[]> {
  const { designer, engineer, lead, admin } = s.users;
  const draft = await createDraft(t.app, s);
  const review = await createDraft(t.app, s);
  await request(t.app).post(`/api/requests/${review.id}/actions`).set(designer.auth).send({ action: 'submit', version: review.version });
  const bill = await BillOfPartsModel.findOne({ where: { productId: s.products.kite.id } });
  const tool = { name: 'Fuzz head', brandId: s.brand.id, factoryId: s.factory.id, construction: 'aluminium', moldClass: 104, cavityCount: 2, weightKg: 120 };
  return [
    { name: 'create tool', method: 'post', path: '/api/tools', auth: engineer.auth, base: { ...tool, code: code('FZ') }, schema: createToolInput },
    { name: 'edit tool', method: 'patch', path: `/api/tools/${s.otherTool.id}`, auth: engineer.auth, base: { version: 0, name: 'Renamed' }, schema: updateToolInput },
    { name: 'retention decision', method: 'post', path: `/api/tools/${s.otherTool.id}/retention-decision`, auth: engineer.auth, base: { version: 0, decision: 'keep_until', keepUntil: '2031-01-01', note: 'Reissue planned' }, schema: retentionDecisionInput },
    { name: 'create part', method: 'post', path: `/api/tools/${s.otherTool.id}/parts`, auth: engineer.auth, base: { name: `Fin ${uid()}`, resin: 'ABS', cavitiesPerShot: 1 }, schema: createPartInput },
    { name: 'edit part', method: 'patch', path: `/api/parts/${s.otherPart.id}`, auth: engineer.auth, base: { resin: 'PP' }, schema: updatePartInput },
    { name: 'create product', method: 'post', path: '/api/products', auth: engineer.auth, base: { sku: `FZ-${uid()}`, name: 'Fuzz kite', brandId: s.brand.id }, schema: createProductInput },
    { name: 'edit product', method: 'patch', path: `/api/products/${s.products.unrelated.id}`, auth: engineer.auth, base: { version: 0, name: 'Renamed kite' }, schema: updateProductInput },
    { name: 'create bill entry', method: 'post', path: `/api/products/${s.products.unrelated.id}/bill`, auth: engineer.auth, base: { partId: s.otherPart.id, quantityPerUnit: 1 }, schema: createBillEntryInput },
    ...(bill ? [{ name: 'edit bill entry', method: 'patch' as const, path: `/api/bill-entries/${bill.id}`, auth: engineer.auth, base: { quantityPerUnit: 2 }, schema: updateBillEntryInput }] : []),
    { name: 'create request', method: 'post', path: '/api/requests', auth: designer.auth, base: { toolId: s.tool.id, title: 'Fuzz ridge', reason: 'Derivative', items: [ridgeItem(s.head.id)] }, schema: createRequestInput },
    { name: 'edit request', method: 'patch', path: `/api/requests/${draft.id}`, auth: designer.auth, base: { version: draft.version, title: 'Fuzz ridge renamed' }, schema: updateRequestInput },
    { name: 'take action', method: 'post', path: `/api/requests/${review.id}/actions`, auth: engineer.auth, base: { action: 'return_to_draft', version: review.version + 1, comment: 'Depth missing' }, schema: takeActionInput },
    { name: 'record cut (shape)', method: 'post', path: `/api/requests/${review.id}/actions`, auth: lead.auth, base: { action: 'record_cut', version: 0, cut: { actualCostCents: 100, cutOn: '2026-11-20', note: '' } }, schema: takeActionInput },
    { name: 'save numbers', method: 'put', path: `/api/requests/${review.id}/numbers`, auth: engineer.auth, base: { version: review.version + 1 }, schema: saveNumbersInput },
    { name: 'create brand', method: 'post', path: '/api/brands', auth: admin.auth, base: { code: `F${uid().slice(0, 4).toUpperCase()}`, name: 'Fuzz brand' }, schema: createBrandInput },
    { name: 'create factory', method: 'post', path: '/api/factories', auth: admin.auth, base: { name: `Fuzz works ${uid()}`, city: 'Dongguan', country: 'China', timeZone: 'Asia/Shanghai' }, schema: createFactoryInput },
    { name: 'create user', method: 'post', path: '/api/users', auth: admin.auth, base: { email: `fz-${uid()}@test.example`, name: 'Fuzz user', role: 'designer', brandIds: [s.brand.id] }, schema: createUserInput },
    { name: 'edit user', method: 'patch', path: `/api/users/${s.users.otherDesigner.user.id}`, auth: admin.auth, base: { name: 'Renamed user' }, schema: updateUserInput },
    { name: 'set language', method: 'put', path: '/api/me/language', auth: designer.auth, base: { language: 'en' } },
    { name: 'change password', method: 'post', path: '/api/auth/change-password', auth: designer.auth, base: { currentPassword: 'wrong-password-here', newPassword: 'another-long-password' } },
    { name: 'sign in', method: 'post', path: '/api/auth/sign-in', auth: {}, base: { email: `nobody-${uid()}@test.example`, password: 'not-the-password' }, schema: signInInput },
  ];
}

describe('no write route answers 5xx to bad input', () => {
  let scene: Scene;
  let all: Route[];
  beforeAll(async () => {
    scene = await makeScene();
    all = await routes(scene);
  });

  it('when each write route gets hostile bodies, then every answer is below 500', async () => {
    const failures: string[] = [];
    const answered = new Map<string, Set<number>>();
    for (const route of all) {
      const plain = await request(t.app)[route.method](route.path).set(route.auth).send(route.base);
      answered.set(`${route.name} (valid)`, new Set([plain.status]));
      await fc.assert(
        fc.asyncProperty(bodies(route.base, route.schema), async (body) => {
          const res = await request(t.app)[route.method](route.path).set(route.auth).send(body as object);
          answered.set(route.name, (answered.get(route.name) ?? new Set()).add(res.status));
          if (res.status >= 500) failures.push(`${route.name}: ${res.status} for ${JSON.stringify(body).slice(0, 300)}`);
          return res.status < 500;
        }),
        { numRuns: RUNS, seed: 4471, endOnFailure: true },
      ).catch(() => undefined);
    }
    expect(failures).toEqual([]);
    expect(all.length).toBeGreaterThanOrEqual(20);
    // The bodies reach the routes' own checks (not only the door): each route answered every run.
    expect([...answered.keys()].filter((k) => !k.endsWith('(valid)')).sort()).toEqual(all.map((r) => r.name).sort());
    if (process.env.FUZZ_REPORT) console.log([...answered].map(([k, v]) => `${k}: ${[...v].sort().join(' ')}`).join('\n'));
  });

  it('when the CSV import gets hostile cells, then every answer is below 500', async () => {
    const header = 'code,name,brand_code,factory,construction,mold_class,rated_shots,rated_shots_source,cavity_count,weight_kg,build_cost,currency,build_date,shot_count,last_run_date,status,storage_location';
    const cellText = fc.oneof(hostile.filter((v) => typeof v === 'string'), fc.string({ maxLength: 12 })).map((v) => String(v).replace(/[",\r\n]/g, ''));
    await fc.assert(
      fc.asyncProperty(fc.array(cellText, { minLength: 17, maxLength: 17 }), fc.boolean(), async (cells, dryRun) => {
        const row = [code('FC'), 'Fuzz', scene.brand.code, scene.factory.name, 'aluminium', '104', ...cells.slice(6)];
        const res = await request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: String(dryRun) }).set(scene.users.engineer.auth).set('content-type', 'text/csv').send(`${header}\n${row.join(',')}`);
        return res.status < 500;
      }),
      { numRuns: RUNS * 2, seed: 4471 },
    );
  });
});
