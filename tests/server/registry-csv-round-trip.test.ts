import { ToolModel } from '../../server/models';
import { makeBrand, makeFactory, makeUser, openTestApp, request } from './helpers';
import { makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

describe('tool CSV round trip', () => {
  it('when formula-like values are exported and the export is imported, then every row is unchanged and the values keep no apostrophe', async () => {
    const brand = await makeBrand();
    const factory = await makeFactory();
    const engineer = await makeUser('engineer', { brandIds: [brand.id] });
    const names = ['=SUM(A1:A3) head', '+Visor insert', '-Ridge core', '@Cap cavity', "'=Quoted already"];
    const tools: Awaited<ReturnType<typeof makeTool>>[] = [];
    for (const name of names) tools.push(await makeTool({ brandId: brand.id, factoryId: factory.id, name }));
    await ToolModel.update({ storageLocation: '=Rack 7' }, { where: { id: tools[0].id } });

    const exported = await request(t.app).get('/api/tools/export.csv').query({ brandId: brand.id }).set(engineer.auth);
    expect(exported.status).toBe(200);
    // The guard is there in the file (a spreadsheet does not run these cells) ...
    expect(exported.text).toContain("'=SUM(A1:A3) head");
    expect(exported.text).toContain("''=Quoted already");

    // ... and the import reads it back as it was.
    const dry = await request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: 'true' }).set(engineer.auth).set('content-type', 'text/csv').send(exported.text);
    expect(dry.status).toBe(200);
    const mine = dry.body.rows.filter((r: { key: string }) => tools.some((tool) => tool.code === r.key));
    expect(mine).toHaveLength(names.length);
    expect(mine.map((r: { action: string }) => r.action)).toEqual(names.map(() => 'unchanged'));

    const real = await request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: 'false' }).set(engineer.auth).set('content-type', 'text/csv').send(exported.text);
    expect(real.status).toBe(200);
    const after = await ToolModel.findAll({ where: { id: tools.map((tool) => tool.id) } });
    expect(after.map((tool) => tool.name).sort()).toEqual([...names].sort());
    expect(after.find((tool) => tool.id === tools[0].id)!.storageLocation).toBe('=Rack 7');
  });
});
