import { Op } from 'sequelize';
import { AuditEventModel, BillOfPartsModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../../server/models';
import { makeBrand, makeFactory, makeUser, openTestApp, request, uid } from './helpers';
import { makePart, makeProduct, makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

const TOOL_HEADER = 'code,name,brand_code,factory,construction,mold_class,rated_shots,rated_shots_source,cavity_count,weight_kg,build_cost,currency,build_date,shot_count,last_run_date,status,storage_location';

async function world() {
  const brand = await makeBrand();
  const factory = await makeFactory();
  const engineer = await makeUser('engineer', { brandIds: [brand.id] });
  const prefix = `CS${uid().slice(0, 5).toUpperCase()}`;
  return { brand, factory, engineer, prefix };
}

const importCsv = (auth: Record<string, string>, kind: string, csv: string, dryRun: boolean) =>
  request(t.app).post('/api/registry/import').query({ kind, dryRun: String(dryRun) }).set(auth).set('content-type', 'text/csv').send(csv);

const countCodes = (prefix: string) => ToolModel.count({ where: { code: { [Op.like]: `${prefix}-%` } } });

describe('tool CSV import', () => {
  it('when a dry run has bad rows, then each is reported by line and column and nothing is written', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = [
      TOOL_HEADER,
      `${prefix}-1,Ranger head,${brand.code},${factory.name},pre_hardened_steel,103,,,4,380,18500.00,USD,2021-03-15,212400,2026-10-01,active,Bay C`,
      `${prefix}-2,Bad class,${brand.code},${factory.name},pre_hardened_steel,107,,,4,,,,,,,,`,
      `${prefix}-3,Bad money,${brand.code},${factory.name},aluminium,104,,,2,,12.345,USD,,,,,`,
      `${prefix}-4,Unknown brand,NOPE,${factory.name},aluminium,104,,,2,,,,,,,,`,
      `${prefix}-1,Duplicate,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,`,
      `${prefix}-6,Bad dates,${brand.code},Nowhere Works,stainless,102,,,2,,,,2022-01-01,,2021-01-01,,`,
      `${prefix}-7,No cavity,${brand.code},${factory.name},steel,103,,,0,-5,,,,,,,`,
    ].join('\n');
    const res = await importCsv(engineer.auth, 'tools', csv, true);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ kind: 'tools', dryRun: true, applied: false, totalRows: 7, created: 1, errorRows: 6, fileErrors: [] });
    const byLine = Object.fromEntries(res.body.rows.map((r: { line: number; action: string; errors: { column: string | null }[] }) => [r.line, r]));
    expect(byLine[2]).toMatchObject({ action: 'create', key: `${prefix}-1`, errors: [] });
    expect(byLine[3].errors.map((e: { column: string }) => e.column)).toEqual(['mold_class']);
    expect(byLine[4].errors).toEqual([{ column: 'build_cost', message: expect.stringMatching(/more than 2 decimal places/) }]);
    expect(byLine[5].errors).toEqual([{ column: 'brand_code', message: 'No brand with code NOPE' }]);
    expect(byLine[6].errors[0].message).toMatch(/also on line 2/);
    expect(byLine[7].errors.map((e: { column: string }) => e.column).sort()).toEqual(['factory', 'last_run_date']);
    expect(byLine[8].errors.map((e: { column: string }) => e.column).sort()).toEqual(['cavity_count', 'construction', 'weight_kg']);
    expect(await countCodes(prefix)).toBe(0);
  });

  it('when a real run has one bad row, then 400 with the report and nothing at all is written, not even the good rows or audit events', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = [
      TOOL_HEADER,
      `${prefix}-1,Good one,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,`,
      `${prefix}-2,Good two,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,`,
      `${prefix}-3,Bad one,${brand.code},${factory.name},aluminium,104,,,2,,,,,-1,,,`,
    ].join('\r\n');
    const res = await importCsv(engineer.auth, 'tools', csv, false);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toMatch(/Nothing was imported: 1 of 3 rows have errors/);
    expect(res.body.error.report).toMatchObject({ applied: false, errorRows: 1, rows: [{ action: 'create' }, { action: 'create' }, { action: 'error', line: 4 }] });
    expect(await countCodes(prefix)).toBe(0);
    expect(await AuditEventModel.count({ where: { action: 'tool.create', actorId: engineer.user.id } })).toBe(0);
  });

  it('when a real run is clean, then every row is written in one go with revision 1, class defaults and an audit event each', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = [
      TOOL_HEADER,
      `${prefix}-1,Ranger head,${brand.code.toLowerCase()},${factory.name.toUpperCase()},Pre_Hardened_Steel,103,,,4,380.5,"18,500.00",usd,2021-03-15,212400,2026-10-01,idle,"Bay C, rack 4"`,
      `${prefix}-2,Buggy chassis,${brand.code},${factory.name},hardened_steel,101,1200000,Mold maker quotation Q-7,1,1250,96000,USD,,,,,`,
    ].join('\n');
    const res = await importCsv(engineer.auth, 'tools', csv, false);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ applied: true, created: 2, errorRows: 0 });
    const one = await ToolModel.findOne({ where: { code: `${prefix}-1` } });
    expect(one).toMatchObject({ ratedShots: 500_000, weightKg: 380.5, buildCostCents: 1_850_000, shotCount: 212_400, status: 'idle', storageLocation: 'Bay C, rack 4' });
    expect(one!.ratedShotsSource).toMatch(/Kaysun/);
    const two = await ToolModel.findOne({ where: { code: `${prefix}-2` } });
    expect(two).toMatchObject({ ratedShots: 1_200_000, ratedShotsSource: 'Mold maker quotation Q-7', buildCostCents: 9_600_000, status: 'active', shotCount: 0 });
    expect(await ToolRevisionModel.count({ where: { toolId: [one!.id, two!.id], number: 1 } })).toBe(2);
    expect(await AuditEventModel.count({ where: { action: 'tool.create', entityId: [one!.id, two!.id] } })).toBe(2);

    // Importing again with a change updates that row and leaves the other alone.
    const again = await importCsv(engineer.auth, 'tools', csv.replace('212400', '250000'), false);
    expect(again.body).toMatchObject({ created: 0, updated: 1, unchanged: 1 });
    await one!.reload();
    expect(one!.shotCount).toBe(250_000);
    expect(one!.version).toBe(1);
  });

  it('when the file has unknown or missing columns, then a file error explains it', async () => {
    const { engineer } = await world();
    const res = await importCsv(engineer.auth, 'tools', 'code,name,biuld_date\nX-1,y,2020-01-01', true);
    expect(res.status).toBe(200);
    expect(res.body.fileErrors.join(' ')).toMatch(/Missing columns: brand_code, factory, construction, mold_class, cavity_count/);
    expect(res.body.fileErrors.join(' ')).toMatch(/Unknown column: biuld_date/);
  });

  it('when a disposed tool is in the file with changes, then that row is refused', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'disposed' });
    const csv = `${TOOL_HEADER}\n${tool.code},Renamed,${brand.code},${factory.name},pre_hardened_steel,103,,,4,,,,,,,,`;
    const res = await importCsv(engineer.auth, 'tools', csv, true);
    expect(res.body.rows[0].errors[0].message).toMatch(/disposed: its record is read-only/);
  });

  it('when a tool row lowers the cavity count below what its parts take, then that row is refused', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, cavityCount: 4 });
    await makePart(tool.id, 'Head', 3);
    const csv = `${TOOL_HEADER}\n${tool.code},${tool.name},${brand.code},${factory.name},pre_hardened_steel,103,,,2,,,,,,,,`;
    const res = await importCsv(engineer.auth, 'tools', csv, true);
    expect(res.body.rows[0]).toMatchObject({ action: 'error', errors: [{ column: 'cavity_count', message: 'The parts of this tool already take 3 cavities' }] });
  });

  it.each(['designer', 'brand_lead', 'toolmaker'] as const)('when a %s imports, then 403', async (role) => {
    const user = await makeUser(role);
    expect((await importCsv(user.auth, 'tools', `${TOOL_HEADER}\n`, true)).status).toBe(403);
  });

  it('when the CSV comes as JSON { csv }, then it is read the same way', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const csv = `${TOOL_HEADER}\n${prefix}-1,Head,${brand.code},${factory.name},aluminium,104,,,2,,,,,,,,`;
    const res = await request(t.app).post('/api/registry/import').query({ kind: 'tools' }).set(engineer.auth).send({ csv });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: true, created: 1 });
    const bad = await request(t.app).post('/api/registry/import').query({ kind: 'gears' }).set(engineer.auth).send({ csv });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('kind');
  });

  it('when 1,000 tools are imported, then all are written in one transaction within a few seconds', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const rows = Array.from({ length: 1000 }, (_, i) => {
      const n = String(i).padStart(4, '0');
      const shots = (i * 997) % 500_000;
      return `${prefix}-${n},Tool ${n},${brand.code},${factory.name},pre_hardened_steel,103,,,4,${300 + (i % 50)},${15000 + i}.00,USD,2020-01-15,${shots},2025-0${(i % 9) + 1}-15,active,Rack ${i % 40}`;
    });
    const csv = [TOOL_HEADER, ...rows].join('\n');
    const dryStart = performance.now();
    const dry = await importCsv(engineer.auth, 'tools', csv, true);
    const dryMs = performance.now() - dryStart;
    expect(dry.body).toMatchObject({ totalRows: 1000, created: 1000, errorRows: 0 });
    const start = performance.now();
    const res = await importCsv(engineer.auth, 'tools', csv, false);
    const ms = performance.now() - start;
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ applied: true, created: 1000 });
    expect(await countCodes(prefix)).toBe(1000);
    expect(await AuditEventModel.count({ where: { action: 'tool.create', actorId: engineer.user.id } })).toBe(1000);
    const list = await request(t.app).get('/api/tools').query({ brandId: brand.id, limit: 100 }).set(engineer.auth);
    expect(list.body.data).toHaveLength(100);
    expect(list.body.data[0].code).toBe(`${prefix}-0000`);
    console.info(`1,000-tool CSV import: dry run ${Math.round(dryMs)} ms, real run ${Math.round(ms)} ms`);
    expect(ms).toBeLessThan(15_000);
  });
});

describe('parts, products and bill CSV import', () => {
  it('when parts, products and bill lines are imported in order, then the product can be made from those tools', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-HEAD`, cavityCount: 4 });
    await makePart(tool.id, 'Head', 2);
    const parts = await importCsv(
      engineer.auth,
      'parts',
      `tool_code,part_name,resin,cavities_per_shot\n${tool.code.toLowerCase()},Visor,PC,2\n${tool.code},Head,ABS,2`,
      false,
    );
    expect(parts.status).toBe(200);
    expect(parts.body).toMatchObject({ created: 1, unchanged: 1 });
    const products = await importCsv(
      engineer.auth,
      'products',
      `sku,name,brand_code,status,fob,wholesale,retail,currency,planned_units\n${prefix}-KITE,Ranger Kite,${brand.code},reissue_planned,3.10,6.50,12.99,USD,40000`,
      false,
    );
    expect(products.body).toMatchObject({ created: 1 });
    const product = await ProductModel.findOne({ where: { sku: `${prefix}-KITE` } });
    expect(product).toMatchObject({ fobCents: 310, wholesaleCents: 650, retailCents: 1299, plannedUnits: 40_000, status: 'reissue_planned' });
    const bill = await importCsv(
      engineer.auth,
      'bill',
      `sku,tool_code,part_name,revision,quantity_per_unit\n${prefix}-KITE,${tool.code},Head,,1\n${prefix}-KITE,${tool.code},Visor,1,1`,
      false,
    );
    expect(bill.body).toMatchObject({ created: 2, errorRows: 0 });
    const detail = await request(t.app).get(`/api/products/${product!.id}`).set(engineer.auth);
    expect(detail.body.makeability.canBeMade).toBe(true);
    expect(detail.body.bill).toHaveLength(2);
  });

  it('when part rows would take more cavities than the tool has, or name a missing tool, then they are reported and nothing is written', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-T`, cavityCount: 2 });
    const csv = `tool_code,part_name,resin,cavities_per_shot\n${tool.code},A,ABS,1\n${tool.code},B,ABS,2\n${prefix}-MISSING,C,ABS,1`;
    const res = await importCsv(engineer.auth, 'parts', csv, false);
    expect(res.status).toBe(400);
    const rows = res.body.error.report.rows;
    expect(rows.map((r: { action: string }) => r.action)).toEqual(['error', 'error', 'error']);
    expect(rows[0].errors[0].message).toMatch(/has 2 cavities; its parts would take 3/);
    expect(rows[2].errors[0]).toEqual({ column: 'tool_code', message: `No tool with code ${prefix}-MISSING` });
    expect(await PartModel.count({ where: { toolId: tool.id } })).toBe(0);
  });

  it('when bill rows name a missing part or revision, then they are reported and nothing is written', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-T` });
    await makePart(tool.id, 'Head');
    const product = await makeProduct(brand.id, { sku: `${prefix}-P` });
    const csv = `sku,tool_code,part_name,revision,quantity_per_unit\n${product.sku},${tool.code},Head,2,1\n${product.sku},${tool.code},Wing,,1\n${prefix}-NOPE,${tool.code},Head,,1`;
    const res = await importCsv(engineer.auth, 'bill', csv, false);
    expect(res.status).toBe(400);
    const errs = res.body.error.report.rows.map((r: { errors: { column: string }[] }) => r.errors.map((e) => e.column));
    expect(errs).toEqual([['revision'], ['part_name'], ['sku']]);
    expect(await BillOfPartsModel.count({ where: { productId: product.id } })).toBe(0);
  });
});

describe('one rule for the API and the CSV import', () => {
  it('when a tool row gives rated shots with a source too short for the API, then the import refuses it as the API does', async () => {
    const { brand, factory, engineer, prefix } = await world();
    const api = await request(t.app)
      .post('/api/tools')
      .set(engineer.auth)
      .send({ code: `${prefix}-9`, name: 'Short source', brandId: brand.id, factoryId: factory.id, construction: 'aluminium', moldClass: 104, ratedShots: 90000, ratedShotsSource: 'ok', cavityCount: 2 });
    expect(api.status).toBe(400);
    expect(api.body.error.fieldErrors.ratedShotsSource).toBeDefined();

    const csv = [TOOL_HEADER, `${prefix}-1,Short source,${brand.code},${factory.name},aluminium,104,90000,ok,2,,,,,,,,`].join('\n');
    const res = await importCsv(engineer.auth, 'tools', csv, true);
    expect(res.status).toBe(200);
    expect(res.body.rows[0]).toMatchObject({ action: 'error', errors: [{ column: 'rated_shots_source', message: 'Say where the rated shots come from' }] });
  });

  it('when a tool is renamed through the CSV import and another through the API, then both audit events keep the same fields', async () => {
    const { brand, factory, engineer } = await world();
    const viaApi = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const viaCsv = await makeTool({ brandId: brand.id, factoryId: factory.id });
    expect((await request(t.app).patch(`/api/tools/${viaApi.id}`).set(engineer.auth).send({ version: 0, name: 'Renamed by form' })).status).toBe(200);
    const csv = [TOOL_HEADER, `${viaCsv.code},Renamed by file,${brand.code},${factory.name},${viaCsv.construction},${viaCsv.moldClass},,,${viaCsv.cavityCount},,,,,,,,`].join('\n');
    const res = await importCsv(engineer.auth, 'tools', csv, false);
    expect(res.status).toBe(200);
    expect(res.body.updated).toBe(1);
    const apiEvent = await AuditEventModel.findOne({ where: { entityId: viaApi.id, action: 'tool.update' } });
    const csvEvent = await AuditEventModel.findOne({ where: { entityId: viaCsv.id, action: 'tool.update' } });
    expect(Object.keys(csvEvent!.after as object).sort()).toEqual(Object.keys(apiEvent!.after as object).sort());
    expect(Object.keys(csvEvent!.before as object).sort()).toEqual(Object.keys(apiEvent!.before as object).sort());
    expect(csvEvent!.after).toMatchObject({ name: 'Renamed by file' });
  });

  it('when the import lists its columns, then they are the row schema keys and the required ones are those without a default', async () => {
    const { engineer } = await world();
    const res = await importCsv(engineer.auth, 'parts', 'tool_code,part_name,colour\nX-1,Head,Red', true);
    expect(res.body.fileErrors).toEqual(['Missing columns: resin, cavities_per_shot', 'Unknown column: colour (expected: tool_code, part_name, resin, cavities_per_shot)']);
  });
});
