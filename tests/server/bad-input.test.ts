import { ToolModel, AuditEventModel } from '../../server/models';
import { makeBrand, makeFactory, makeUser, openTestApp, request, uid } from './helpers';
import { makeTool } from './registry-helpers';
import { createDraft, makeScene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

const TOOL_HEADER = 'code,name,brand_code,factory,construction,mold_class,rated_shots,rated_shots_source,cavity_count,weight_kg,build_cost,currency,build_date,shot_count,last_run_date,status,storage_location';

async function world() {
  const brand = await makeBrand();
  const factory = await makeFactory();
  const engineer = await makeUser('engineer', { brandIds: [brand.id] });
  const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
  return { brand, factory, engineer, tool, prefix: `BI${uid().slice(0, 5).toUpperCase()}` };
}

const importCsv = (auth: Record<string, string>, csv: string, dryRun: boolean) =>
  request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: String(dryRun) }).set(auth).set('content-type', 'text/csv').send(csv);

describe('dates stay in a range every computation can hold', () => {
  it('when a tool edit gives 9999-12-31, then 400 on that field and the tool list, search and export still answer', async () => {
    const { engineer, tool, brand } = await world();
    const res = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, lastRunDate: '9999-12-31' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.lastRunDate[0]).toMatch(/between 1900-01-01 and 2200-12-31/);
    expect((await request(t.app).get('/api/tools').query({ brandId: brand.id }).set(engineer.auth)).status).toBe(200);
    expect((await request(t.app).get('/api/tools').query({ q: tool.code }).set(engineer.auth)).status).toBe(200);
    expect((await request(t.app).get('/api/tools/export.csv').query({ brandId: brand.id }).set(engineer.auth)).status).toBe(200);
  });

  it('when a CSV row has a far-future build date, then the dry run reports it on its column and the real run writes nothing', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = `${TOOL_HEADER}\n${prefix}-1,Far head,${brand.code},${factory.name},aluminium,104,,,2,,,,9999-12-31,,,,`;
    const dry = await importCsv(engineer.auth, csv, true);
    expect(dry.status).toBe(200);
    expect(dry.body.rows[0].errors).toEqual([{ column: 'build_date', message: expect.stringMatching(/between/) }]);
    expect((await importCsv(engineer.auth, csv, false)).status).toBe(400);
    expect(await ToolModel.count({ where: { code: `${prefix}-1` } })).toBe(0);
  });

  it('when a request is given a due date in 9997, then 400 on targetDate, never 500', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await request(t.app).patch(`/api/requests/${d.id}`).set(s.users.designer.auth).send({ version: d.version, targetDate: '9997-01-01' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('targetDate');
  });
});

describe('numbers and text the columns can store', () => {
  it('when a weight rounds to 0 in the column (0.001 kg), then 400 on weightKg', async () => {
    const { engineer, tool } = await world();
    const res = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, weightKg: 0.001 });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.weightKg[0]).toMatch(/2 decimals/);
    expect((await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, weightKg: 850.25 })).status).toBe(200);
  });

  it('when a CSV storage location is longer than the column, then the dry run already says so', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = `${TOOL_HEADER}\n${prefix}-1,Long bay,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,${'B'.repeat(161)}`;
    const dry = await importCsv(engineer.auth, csv, true);
    expect(dry.body.rows[0].errors).toEqual([{ column: 'storage_location', message: 'Use at most 160 characters' }]);
    expect((await importCsv(engineer.auth, csv, false)).status).toBe(400);
  });

  it.each([
    ['a NUL', 'Ranger\u0000head', /NUL/],
    ['a lone surrogate', 'Ranger \uD83D head', /broken character/],
  ])('when a tool name holds %s, then 400 on name, nothing stored and nothing audited', async (_what, name, message) => {
    const { engineer, tool } = await world();
    const res = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, name });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.name[0]).toMatch(message);
    expect((await ToolModel.findByPk(tool.id))!.name).toBe(tool.name);
    expect(await AuditEventModel.count({ where: { entityId: tool.id } })).toBe(0);
  });

  it('when a request title holds a NUL or an action comment half an emoji, then 400 naming the field', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await request(t.app).patch(`/api/requests/${d.id}`).set(s.users.designer.auth).send({ version: d.version, title: 'Visor\u0000ridge' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('title');
    const act = await request(t.app).post(`/api/requests/${d.id}/actions`).set(s.users.designer.auth).send({ action: 'withdraw', version: d.version, comment: 'half \uDE00 an emoji' });
    expect(act.status).toBe(400);
    expect(act.body.error.fieldErrors).toHaveProperty('comment');
  });

  it('when a search or a CSV cell holds a NUL, then 400 or a row error, never 500', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const search = await request(t.app).get('/api/tools').query({ q: 'KB\u0000' }).set(engineer.auth);
    expect(search.status).toBe(400);
    const csv = `${TOOL_HEADER}\n${prefix}-1,Nul\u0000head,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,`;
    const dry = await importCsv(engineer.auth, csv, true);
    expect(dry.status).toBe(200);
    expect(dry.body.rows[0].errors).toEqual([{ column: 'name', message: expect.stringMatching(/NUL/) }]);
  });

  it('when an upload is named with a lone surrogate, then it is stored with a replacement character', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const { default: sharp } = await import('sharp');
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#123456' } }).png().toBuffer();
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set(s.users.designer.auth).field('kind', 'before').attach('file', png, 'half-\uD83D.png');
    expect(res.status).toBe(201);
  });
});
