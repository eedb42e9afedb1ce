import { addYears, format, parseISO } from 'date-fns';
import { addCalendarDays, todayInZone } from '../../shared/domain/retention';
import { AuditEventModel, ToolModel, ToolRevisionModel } from '../../server/models';
import { makeBrand, makeFactory, makeUser, openTestApp, request, uid } from './helpers';
import { bind, code, makePart, makeProduct, makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

const today = () => todayInZone('UTC');

async function world() {
  const brand = await makeBrand();
  const factory = await makeFactory();
  const otherFactory = await makeFactory();
  const engineer = await makeUser('engineer', { brandIds: [brand.id] });
  return { brand, factory, otherFactory, engineer };
}

function validTool(brandId: string, factoryId: string) {
  return { code: code('KB'), name: 'Ranger head', brandId, factoryId, construction: 'pre_hardened_steel', moldClass: 103, cavityCount: 4, weightKg: 380 };
}

describe('creating and editing tools', () => {
  it('when an engineer creates a tool without rated shots, then 201 with the class 103 figure, its source, revision 1 and an audit event', async () => {
    const { brand, factory, engineer } = await world();
    const body = { ...validTool(brand.id, factory.id), buildCostCents: 1_850_000, buildDate: '2021-03-15' };
    const res = await request(t.app).post('/api/tools').set(engineer.auth).send(body);
    expect(res.status).toBe(201);
    // TRADE-FACTS 1.1 (Kaysun): class 103 "not exceeding 500,000 cycles".
    expect(res.body).toMatchObject({ code: body.code, ratedShots: 500_000, currentRevision: 1, version: 0, readOnly: false, status: 'active' });
    expect(res.body.ratedShotsSource).toMatch(/Kaysun/);
    expect(res.body.life).toMatchObject({ remainingShots: 500_000, percentUsed: '0.0', band: 'fresh' });
    const revisions = await ToolRevisionModel.findAll({ where: { toolId: res.body.id } });
    expect(revisions.map((r) => [r.number, r.madeOn, r.note])).toEqual([[1, '2021-03-15', 'As built']]);
    const audit = await AuditEventModel.findOne({ where: { entity: 'tool', entityId: res.body.id, action: 'tool.create' } });
    expect(audit?.actorId).toBe(engineer.user.id);
  });

  it('when rated shots are given without a source, then 400 on ratedShotsSource', async () => {
    const { brand, factory, engineer } = await world();
    const res = await request(t.app).post('/api/tools').set(engineer.auth).send({ ...validTool(brand.id, factory.id), ratedShots: 250_000 });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('ratedShotsSource');
  });

  it.each(['designer', 'brand_lead', 'toolmaker'] as const)('when a %s creates or edits a tool, then 403 and nothing is written', async (role) => {
    const { brand, factory } = await world();
    const user = await makeUser(role, { brandIds: role === 'toolmaker' ? [] : [brand.id], factoryId: role === 'toolmaker' ? factory.id : undefined });
    const body = validTool(brand.id, factory.id);
    const res = await request(t.app).post('/api/tools').set(user.auth).send(body);
    expect(res.status).toBe(403);
    expect(await ToolModel.count({ where: { code: body.code } })).toBe(0);
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const patch = await request(t.app).patch(`/api/tools/${tool.id}`).set(user.auth).send({ version: 0, name: 'x' });
    expect(patch.status).toBe(403);
    const decision = await request(t.app).post(`/api/tools/${tool.id}/retention-decision`).set(user.auth).send({ version: 0, decision: 'scrap', note: 'no' });
    expect(decision.status).toBe(403);
  });

  it('when the input breaks the rules, then 400 with a field error on each bad field', async () => {
    const { brand, factory, engineer } = await world();
    const res = await request(t.app)
      .post('/api/tools')
      .set(engineer.auth)
      .send({ ...validTool(brand.id, factory.id), moldClass: 106, cavityCount: 0, buildCostCents: -1, status: 'disposed' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['buildCostCents', 'cavityCount', 'moldClass', 'status']);
    const dates = await request(t.app)
      .post('/api/tools')
      .set(engineer.auth)
      .send({ ...validTool(brand.id, factory.id), lastRunDate: '2019-01-01', buildDate: '2020-01-01' });
    expect(dates.status).toBe(400);
    expect(Object.keys(dates.body.error.fieldErrors)).toEqual(['lastRunDate']);
  });

  it('when the code is taken, then 409 with a field error on code', async () => {
    const { brand, factory, engineer } = await world();
    const existing = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const res = await request(t.app).post('/api/tools').set(engineer.auth).send({ ...validTool(brand.id, factory.id), code: existing.code.toLowerCase() });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors).toHaveProperty('code');
  });

  it('when two people edit from the same version, then the second gets 409 stale_version with the current tool', async () => {
    const { brand, factory, engineer } = await world();
    const admin = await makeUser('admin');
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const first = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, shotCount: 5000 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ version: 1, shotCount: 5000 });
    const second = await request(t.app).patch(`/api/tools/${tool.id}`).set(admin.auth).send({ version: 0, storageLocation: 'Rack 9' });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('stale_version');
    expect(second.body.error.current).toMatchObject({ id: tool.id, version: 1, shotCount: 5000, storageLocation: 'Rack 1' });
    const audit = await AuditEventModel.findOne({ where: { entityId: tool.id, action: 'tool.update' } });
    expect(audit?.before).toMatchObject({ shotCount: 1000 });
    expect(audit?.after).toMatchObject({ shotCount: 5000 });
  });

  it('when the mold class changes and the rated life was the class figure, then it follows the new class; an own figure stays', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, moldClass: 103 });
    const res = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, moldClass: 104 });
    expect(res.body).toMatchObject({ moldClass: 104, ratedShots: 100_000 }); // Kaysun: class 104 not exceeding 100,000
    const own = await makeTool({ brandId: brand.id, factoryId: factory.id, moldClass: 103, ratedShots: 420_000 });
    const res2 = await request(t.app).patch(`/api/tools/${own.id}`).set(engineer.auth).send({ version: 0, moldClass: 102 });
    expect(res2.body).toMatchObject({ moldClass: 102, ratedShots: 420_000, ratedShotsSource: 'Mold maker quotation' });
  });

  it('when the cavity count would drop below what the parts take, then 400', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, cavityCount: 4 });
    await makePart(tool.id, 'Head', 2);
    await makePart(tool.id, 'Visor', 2);
    const res = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, cavityCount: 3 });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.cavityCount[0]).toMatch(/At least 4/);
    const part = await request(t.app).post(`/api/tools/${tool.id}/parts`).set(engineer.auth).send({ name: 'Extra', resin: 'ABS', cavitiesPerShot: 1 });
    expect(part.status).toBe(400);
  });
});

describe('database constraints', () => {
  it('when rows break the rules directly in SQL, then PostgreSQL refuses them', async () => {
    const { brand, factory } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const other = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const part = await makePart(tool.id);
    const product = await makeProduct(brand.id);
    const q = (sql: string) => t.sequelize.query(sql);
    const toolRow = (col: string, value: string) =>
      q(`INSERT INTO tools (id, code, name, brand_id, factory_id, construction, mold_class, rated_shots, rated_shots_source, cavity_count, ${col})
         VALUES (gen_random_uuid(), '${code()}', 'x', '${brand.id}', '${factory.id}', 'aluminium', 104, 100000, 'test', 1, ${value})`);
    await expect(toolRow('build_cost_cents', '-1')).rejects.toThrow(/tools_build_cost_non_negative/);
    await expect(toolRow('shot_count', '-5')).rejects.toThrow(/tools_shot_count_non_negative/);
    await expect(q(`UPDATE tools SET cavity_count = 0 WHERE id = '${tool.id}'`)).rejects.toThrow(/tools_cavities_at_least_one/);
    await expect(q(`UPDATE tools SET mold_class = 106 WHERE id = '${tool.id}'`)).rejects.toThrow(/tools_mold_class_range/);
    await expect(q(`UPDATE tools SET code = '${other.code}' WHERE id = '${tool.id}'`)).rejects.toMatchObject({ parent: { constraint: 'tools_code_unique' } });
    const otherProduct = await makeProduct(brand.id);
    await expect(q(`UPDATE products SET sku = '${otherProduct.sku}' WHERE id = '${product.id}'`)).rejects.toMatchObject({
      parent: { constraint: 'products_sku_unique' },
    });
    await expect(q(`UPDATE parts SET cavities_per_shot = 0 WHERE id = '${part.id}'`)).rejects.toThrow(/parts_cavities_at_least_one/);
    await expect(q(`UPDATE products SET retail_cents = -1 WHERE id = '${product.id}'`)).rejects.toThrow(/products_retail_non_negative/);
    await expect(q(`UPDATE products SET planned_units = -1 WHERE id = '${product.id}'`)).rejects.toThrow(/products_planned_units_non_negative/);
    // A bill line must name a part of its own tool, at a revision that exists.
    await expect(
      q(`INSERT INTO bill_of_parts (id, product_id, part_id, tool_id, revision) VALUES (gen_random_uuid(), '${product.id}', '${part.id}', '${other.id}', 1)`),
    ).rejects.toThrow(/bill_of_parts_part_of_tool/);
    await expect(
      q(`INSERT INTO bill_of_parts (id, product_id, part_id, tool_id, revision) VALUES (gen_random_uuid(), '${product.id}', '${part.id}', '${tool.id}', 2)`),
    ).rejects.toThrow(/bill_of_parts_revision_exists/);
    await expect(q(`UPDATE tools SET retention_decision = 'scrap', retention_decided_at = now() WHERE id = '${tool.id}'`)).rejects.toThrow(
      /tools_scrapped_is_disposed/,
    );
  });
});

describe('who sees which tools', () => {
  it("when a toolmaker asks for another factory's tool, then 404 exactly like a tool that does not exist", async () => {
    const { brand, factory, otherFactory } = await world();
    const toolmaker = await makeUser('toolmaker', { factoryId: factory.id });
    const mine = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const theirs = await makeTool({ brandId: brand.id, factoryId: otherFactory.id });
    expect((await request(t.app).get(`/api/tools/${mine.id}`).set(toolmaker.auth)).status).toBe(200);
    const other = await request(t.app).get(`/api/tools/${theirs.id}`).set(toolmaker.auth);
    const missing = await request(t.app).get(`/api/tools/00000000-0000-4000-8000-000000000000`).set(toolmaker.auth);
    expect(other.status).toBe(404);
    expect(other.body).toEqual(missing.body);
    const list = await request(t.app).get('/api/tools').query({ brandId: brand.id }).set(toolmaker.auth);
    expect(list.body.data.map((x: { id: string }) => x.id)).toEqual([mine.id]);
    // Asking for the other factory by filter does not widen the view.
    const widened = await request(t.app).get('/api/tools').query({ brandId: brand.id, factoryId: otherFactory.id }).set(toolmaker.auth);
    expect(widened.body.data).toEqual([]);
  });

  it('when a designer or brand lead lists tools, then every factory is visible (company roles read the whole register)', async () => {
    const { brand, factory, otherFactory } = await world();
    const lead = await makeUser('brand_lead', { brandIds: [brand.id] });
    await makeTool({ brandId: brand.id, factoryId: factory.id });
    await makeTool({ brandId: brand.id, factoryId: otherFactory.id });
    const list = await request(t.app).get('/api/tools').query({ brandId: brand.id }).set(lead.auth);
    expect(list.status).toBe(200);
    expect(list.body.data).toHaveLength(2);
  });

  it('when not signed in, then 401', async () => {
    expect((await request(t.app).get('/api/tools')).status).toBe(401);
  });
});

describe('listing tools', () => {
  it('when pages are read while tools are added, then no tool is skipped or repeated and earlier pages do not shift', async () => {
    const { brand, factory, engineer } = await world();
    const prefix = `PG${uid().slice(0, 5).toUpperCase()}`;
    for (const n of [10, 20, 30, 40, 50, 60, 70]) await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-${n}` });
    const page1 = await request(t.app).get('/api/tools').query({ brandId: brand.id, limit: 3 }).set(engineer.auth);
    expect(page1.body.data.map((x: { code: string }) => x.code)).toEqual([`${prefix}-10`, `${prefix}-20`, `${prefix}-30`]);
    expect(page1.body.meta.nextCursor).toEqual(expect.any(String));
    // Inserted while the user reads: one before the cursor, one after it.
    await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-15` });
    await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${prefix}-45` });
    const seen = [...page1.body.data.map((x: { code: string }) => x.code)];
    let cursor = page1.body.meta.nextCursor;
    while (cursor) {
      const page = await request(t.app).get('/api/tools').query({ brandId: brand.id, limit: 3, cursor }).set(engineer.auth);
      expect(page.status).toBe(200);
      seen.push(...page.body.data.map((x: { code: string }) => x.code));
      cursor = page.body.meta.nextCursor;
    }
    expect(seen).toEqual([10, 20, 30, 40, 45, 50, 60, 70].map((n) => `${prefix}-${n}`));
  });

  it('when the cursor is garbage, then 400', async () => {
    const { engineer } = await world();
    const res = await request(t.app).get('/api/tools').query({ cursor: 'not-a-cursor' }).set(engineer.auth);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('cursor');
  });

  it('when filters are combined, then only tools matching all of them come back', async () => {
    const { brand, factory, otherFactory, engineer } = await world();
    const otherBrand = await makeBrand();
    const hit = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'idle', shotCount: 450_000, ratedShots: 500_000 });
    await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'active', shotCount: 450_000, ratedShots: 500_000 }); // wrong status
    await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'idle', shotCount: 10, ratedShots: 500_000 }); // fresh
    await makeTool({ brandId: brand.id, factoryId: otherFactory.id, status: 'idle', shotCount: 450_000, ratedShots: 500_000 }); // other factory
    await makeTool({ brandId: otherBrand.id, factoryId: factory.id, status: 'idle', shotCount: 450_000, ratedShots: 500_000 }); // other brand
    const res = await request(t.app)
      .get('/api/tools')
      .query({ brandId: brand.id, factoryId: factory.id, status: 'idle', lifeBand: 'worn' })
      .set(engineer.auth);
    expect(res.status).toBe(200);
    expect(res.body.data.map((x: { id: string }) => x.id)).toEqual([hit.id]);
    expect(res.body.data[0].life).toMatchObject({ percentUsed: '90.0', band: 'worn', remainingShots: 50_000 });
    const bad = await request(t.app).get('/api/tools').query({ lifeBand: 'tired', status: 'gone' }).set(engineer.auth);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fieldErrors).sort()).toEqual(['lifeBand', 'status']);
  });

  it('when searching, then code, name, part name, product name and SKU all find the tool; % is matched literally', async () => {
    const { brand, factory, engineer } = await world();
    const word = `Zq${uid()}`;
    const byCode = await makeTool({ brandId: brand.id, factoryId: factory.id, code: `${word.toUpperCase()}-1` });
    const byName = await makeTool({ brandId: brand.id, factoryId: factory.id, name: `Big ${word} head` });
    const byPart = await makeTool({ brandId: brand.id, factoryId: factory.id });
    await makePart(byPart.id, `Torso ${word}`);
    const byProduct = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const part = await makePart(byProduct.id, 'Arm');
    const product = await makeProduct(brand.id, { name: `Figure ${word}` });
    await bind(product.id, part, 1);
    const bySku = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const skuPart = await makePart(bySku.id, 'Leg');
    const skuProduct = await makeProduct(brand.id, { sku: `SKU-${word.toUpperCase()}` });
    await bind(skuProduct.id, skuPart, 1);
    await makeTool({ brandId: brand.id, factoryId: factory.id, name: 'Unrelated' });

    const res = await request(t.app).get('/api/tools').query({ q: word.toLowerCase(), brandId: brand.id }).set(engineer.auth);
    expect(res.body.data.map((x: { id: string }) => x.id).sort()).toEqual([byCode.id, byName.id, byPart.id, byProduct.id, bySku.id].sort());
    const percent = await request(t.app).get('/api/tools').query({ q: '%', brandId: brand.id }).set(engineer.auth);
    expect(percent.body.data).toEqual([]);
  });
});

describe('retention', () => {
  it('when a tool last ran on 29 February 2024, then the list shows it due on 28 February 2027 (3 years), as date-fns computes', async () => {
    const { brand, factory, engineer } = await world();
    await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: '2024-02-29', buildDate: '2020-01-01' });
    const res = await request(t.app).get('/api/tools').query({ brandId: brand.id }).set(engineer.auth);
    // date-fns addYears clamps 29 February (TRADE-FACTS 9); PostgreSQL's date + interval agrees.
    expect(res.body.data[0].retention).toMatchObject({ dueOn: '2027-02-28', years: 3 });
    expect(format(addYears(parseISO('2024-02-29'), 3), 'yyyy-MM-dd')).toBe('2027-02-28');
    const [row] = await t.sequelize.query(`SELECT ('2024-02-29'::date + make_interval(years => 3))::date::text AS d`, { plain: false });
    expect((row as { d: string }[])[0]!.d).toBe('2027-02-28');
  });

  it('when filtering on retention due, then tools due within the window (overdue included) come back, and the SQL agrees with the DTO', async () => {
    const { brand, factory, engineer } = await world();
    const lastRunFor = (dueInDays: number) => format(addYears(parseISO(addCalendarDays(today(), dueInDays)), -3), 'yyyy-MM-dd');
    const soon = await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: lastRunFor(30), buildDate: '2015-01-01' });
    const overdue = await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: lastRunFor(-10), buildDate: '2015-01-01' });
    const edge = await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: lastRunFor(90), buildDate: '2015-01-01' });
    await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: lastRunFor(91), buildDate: '2015-01-01' });
    await makeTool({ brandId: brand.id, factoryId: factory.id, lastRunDate: lastRunFor(-100), buildDate: '2015-01-01', status: 'disposed' });
    const res = await request(t.app).get('/api/tools').query({ brandId: brand.id, retentionDue: 'true' }).set(engineer.auth);
    const ids = res.body.data.map((x: { id: string }) => x.id);
    expect(ids.sort()).toEqual([soon.id, overdue.id, edge.id].sort());
    for (const row of res.body.data) expect(['due_soon', 'overdue']).toContain(row.retention.state);
    const due = await request(t.app).get('/api/retention/due').query({ days: 90 }).set(engineer.auth);
    const mine = due.body.data.filter((x: { brand: { id: string } }) => x.brand.id === brand.id);
    expect(mine.map((x: { id: string }) => x.id)).toEqual([overdue.id, soon.id, edge.id]); // by due date
    expect(due.body.meta).toMatchObject({ days: 90, years: 3 });
    const narrow = await request(t.app).get('/api/retention/due').query({ days: 20 }).set(engineer.auth);
    expect(narrow.body.data.filter((x: { brand: { id: string } }) => x.brand.id === brand.id).map((x: { id: string }) => x.id)).toEqual([overdue.id]);
  });

  it('when an engineer decides to keep an idle tool until a date, then it is retained and due on that date', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'idle', lastRunDate: '2022-01-01' });
    const keepUntil = addCalendarDays(today(), 400);
    const res = await request(t.app)
      .post(`/api/tools/${tool.id}/retention-decision`)
      .set(engineer.auth)
      .send({ version: 0, decision: 'keep_until', keepUntil, note: 'Reissue under review' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'retained', version: 1, retention: { dueOn: keepUntil, state: 'not_due' } });
    expect(res.body.retention.decision).toMatchObject({ decision: 'keep_until', keepUntil, decidedBy: { id: engineer.user.id }, note: 'Reissue under review' });
    const past = await request(t.app)
      .post(`/api/tools/${tool.id}/retention-decision`)
      .set(engineer.auth)
      .send({ version: 1, decision: 'keep_until', keepUntil: today(), note: 'Too late' });
    expect(past.status).toBe(400);
    expect(past.body.error.fieldErrors).toHaveProperty('keepUntil');
  });

  it('when a tool is scrapped, then it is disposed and read-only: edits, parts and new decisions get 409 with a clear message', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'idle', lastRunDate: '2021-01-01' });
    const part = await makePart(tool.id, 'Head', 1);
    const res = await request(t.app).post(`/api/tools/${tool.id}/retention-decision`).set(engineer.auth).send({ version: 0, decision: 'scrap', note: 'Worn out, no reissue' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'disposed', readOnly: true, retention: { state: 'decided', dueOn: null, decision: { decision: 'scrap' } } });
    const edit = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: res.body.version, name: 'New name' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toMatch(new RegExp(`Tool ${tool.code} was disposed.*can no longer be changed`));
    expect((await request(t.app).post(`/api/tools/${tool.id}/parts`).set(engineer.auth).send({ name: 'Visor', resin: 'PC', cavitiesPerShot: 1 })).status).toBe(409);
    expect((await request(t.app).patch(`/api/parts/${part.id}`).set(engineer.auth).send({ resin: 'PP' })).status).toBe(409);
    const again = await request(t.app).post(`/api/tools/${tool.id}/retention-decision`).set(engineer.auth).send({ version: res.body.version, decision: 'sell', note: 'Buyer found' });
    expect(again.status).toBe(409);
    // Still on record and readable.
    const detail = await request(t.app).get(`/api/tools/${tool.id}`).set(engineer.auth);
    expect(detail.status).toBe(200);
    expect(detail.body.name).toBe(tool.name);
  });

  it('when an admin sets the retention period, then 2 to 5 years are accepted, other values refused, and only admins may', async () => {
    const admin = await makeUser('admin');
    const { engineer } = await world();
    expect((await request(t.app).get('/api/settings/retention').set(engineer.auth)).body).toEqual({ years: 3, min: 2, max: 5, default: 3 });
    expect((await request(t.app).put('/api/settings/retention').set(engineer.auth).send({ years: 4 })).status).toBe(403);
    expect((await request(t.app).put('/api/settings/retention').set(admin.auth).send({ years: 6 })).status).toBe(400);
    expect((await request(t.app).put('/api/settings/retention').set(admin.auth).send({ years: 1 })).status).toBe(400);
    try {
      const res = await request(t.app).put('/api/settings/retention').set(admin.auth).send({ years: 5 });
      expect(res.status).toBe(200);
      expect(res.body.years).toBe(5);
      const audit = await AuditEventModel.findOne({ where: { entity: 'company_setting', actorId: admin.user.id }, order: [['id', 'DESC']] });
      expect(audit?.after).toEqual({ years: 5 });
    } finally {
      await request(t.app).put('/api/settings/retention').set(admin.auth).send({ years: 3 });
    }
  });
});

describe('tool detail', () => {
  it('when a tool has parts, revisions and products, then the detail shows them per revision with whether each can still be made', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, currentRevision: 2, weightKg: 920, shotCount: 450_000, ratedShots: 500_000 });
    const head = await makePart(tool.id, 'Head', 2);
    const visor = await makePart(tool.id, 'Visor', 2);
    const current = await makeProduct(brand.id, { name: 'Storm Kite', sku: code('SK') });
    const old = await makeProduct(brand.id, { name: 'Ranger Kite', sku: code('RK'), status: 'reissue_planned' });
    await bind(current.id, head, 2);
    await bind(current.id, visor, 2);
    await bind(old.id, head, 1);

    const res = await request(t.app).get(`/api/tools/${tool.id}`).set(engineer.auth);
    expect(res.status).toBe(200);
    expect(res.body.parts.map((p: { name: string; productCount: number }) => [p.name, p.productCount])).toEqual([
      ['Head', 2],
      ['Visor', 1],
    ]);
    expect(res.body.revisions.map((r: { number: number; isCurrent: boolean }) => [r.number, r.isCurrent])).toEqual([
      [2, true],
      [1, false],
    ]);
    const rev2 = res.body.revisions[0].products;
    expect(rev2).toHaveLength(1);
    expect(rev2[0]).toMatchObject({ id: current.id, moldableFromThisTool: true, canBeMade: true });
    expect(rev2[0].parts.map((p: { partName: string }) => p.partName)).toEqual(['Head', 'Visor']);
    const rev1 = res.body.revisions[1].products;
    expect(rev1[0]).toMatchObject({ id: old.id, status: 'reissue_planned', moldableFromThisTool: false, canBeMade: false });
    expect(rev1[0].reason).toMatch(/revision 1.*now at revision 2/);
    expect(res.body.openChanges).toEqual([]);
    expect(res.body.life).toMatchObject({ band: 'worn', percentUsed: '90.0' });
    expect(res.body.handling).toMatchObject({ weightKg: 920, heavy: true });
    expect(res.body.handling.caution).toMatch(/qualified riggers/);
  });

  it('when the id is not a UUID, then 404', async () => {
    const { engineer } = await world();
    expect((await request(t.app).get('/api/tools/KB-T-0412').set(engineer.auth)).status).toBe(404);
  });
});

describe('CSV export', () => {
  it('when exporting with filters, then the CSV holds exactly the filtered tools and re-imports as unchanged', async () => {
    const { brand, factory, otherFactory, engineer } = await world();
    const a = await makeTool({ brandId: brand.id, factoryId: factory.id, name: '=HYPERLINK("x")' });
    const b = await makeTool({ brandId: brand.id, factoryId: factory.id });
    await makeTool({ brandId: brand.id, factoryId: otherFactory.id });
    const res = await request(t.app).get('/api/tools/export.csv').query({ brandId: brand.id, factoryId: factory.id }).set(engineer.auth);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toMatch(/^code,name,brand_code,factory,construction,mold_class/);
    expect(lines).toHaveLength(3);
    expect(lines.slice(1).map((l) => l.split(',')[0]).sort()).toEqual([a.code, b.code].sort());
    expect(res.text).toContain(`"'=HYPERLINK(""x"")"`); // formula cells are defused
    const check = await request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: 'true' }).set(engineer.auth).set('content-type', 'text/csv').send(res.text.replace(`'=HYPERLINK`, '=HYPERLINK'));
    expect(check.status).toBe(200);
    expect(check.body).toMatchObject({ totalRows: 2, unchanged: 2, errorRows: 0 });
  });
});
