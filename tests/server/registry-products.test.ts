import { AuditEventModel, BillOfPartsModel, ProductModel } from '../../server/models';
import { makeBrand, makeFactory, makeUser, openTestApp, request, uid } from './helpers';
import { bind, code, makePart, makeProduct, makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

async function world() {
  const brand = await makeBrand();
  const factory = await makeFactory();
  const otherFactory = await makeFactory();
  const engineer = await makeUser('engineer', { brandIds: [brand.id] });
  return { brand, factory, otherFactory, engineer };
}

describe('product detail: can it still be made?', () => {
  it('when every line is at its tool current revision, then it can be made, listing the tools and revisions it needs', async () => {
    const { brand, factory, otherFactory, engineer } = await world();
    const head = await makeTool({ brandId: brand.id, factoryId: factory.id, currentRevision: 2 });
    const body = await makeTool({ brandId: brand.id, factoryId: otherFactory.id, shotCount: 450_000, ratedShots: 500_000 });
    const product = await makeProduct(brand.id, { name: 'Ranger Kite', status: 'reissue_planned' });
    await bind(product.id, await makePart(head.id, 'Head', 2), 2);
    await bind(product.id, await makePart(body.id, 'Torso', 2), 1, 1);
    await bind(product.id, await makePart(body.id, 'Arm', 2), 1, 2);

    const res = await request(t.app).get(`/api/products/${product.id}`).set(engineer.auth);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: product.id, status: 'reissue_planned', hiddenLines: 0, makeability: { canBeMade: true, blockers: [] } });
    expect(res.body.makeability.reason).toMatch(/All 3 parts can be molded from the current revision of 2 tools/);
    expect(res.body.makeability.warnings).toEqual([`Tool ${body.code} has used more than 80 % of its rated life.`]);
    expect(res.body.tools.map((x: { code: string; revisionsNeeded: number[] }) => [x.code, x.revisionsNeeded])).toEqual(
      [
        [head.code, [2]],
        [body.code, [1]],
      ].sort((a, b) => String(a[0]).localeCompare(String(b[0]))),
    );
    expect(res.body.bill).toHaveLength(3);
    expect(res.body.bill.every((l: { moldable: boolean }) => l.moldable)).toBe(true);
  });

  it('when a line needs an older revision or its tool is disposed, then it cannot be made and says why', async () => {
    const { brand, factory, engineer } = await world();
    const recut = await makeTool({ brandId: brand.id, factoryId: factory.id, currentRevision: 2 });
    const gone = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'disposed' });
    const product = await makeProduct(brand.id);
    await bind(product.id, await makePart(recut.id, 'Head'), 1);
    await bind(product.id, await makePart(gone.id, 'Visor'), 1);
    const res = await request(t.app).get(`/api/products/${product.id}`).set(engineer.auth);
    expect(res.body.makeability.canBeMade).toBe(false);
    expect(res.body.makeability.blockers.map((b: { kind: string }) => b.kind).sort()).toEqual(['revision_superseded', 'tool_disposed']);
    const head = res.body.bill.find((l: { part: { name: string } }) => l.part.name === 'Head');
    expect(head).toMatchObject({ moldable: false, problem: expect.stringMatching(/revision 1; the tool is now at revision 2/) });
  });

  it('when a product has no bill of parts, then it cannot be made, and the reason says so', async () => {
    const { brand, engineer } = await world();
    const product = await makeProduct(brand.id);
    const res = await request(t.app).get(`/api/products/${product.id}`).set(engineer.auth);
    expect(res.body.makeability).toMatchObject({ canBeMade: false, blockers: [{ kind: 'no_bill' }] });
  });

  it("when a toolmaker opens a product, then they see only their factory's lines; a product without any is 404", async () => {
    const { brand, factory, otherFactory } = await world();
    const toolmaker = await makeUser('toolmaker', { factoryId: factory.id });
    const mine = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const theirs = await makeTool({ brandId: brand.id, factoryId: otherFactory.id, status: 'disposed' });
    const shared = await makeProduct(brand.id);
    await bind(shared.id, await makePart(mine.id, 'Head'), 1);
    await bind(shared.id, await makePart(theirs.id, 'Body'), 1);
    const foreign = await makeProduct(brand.id);
    await bind(foreign.id, await makePart(theirs.id, 'Wing'), 1);

    const res = await request(t.app).get(`/api/products/${shared.id}`).set(toolmaker.auth);
    expect(res.status).toBe(200);
    expect(res.body.bill.map((l: { tool: { code: string } }) => l.tool.code)).toEqual([mine.code]);
    expect(res.body.hiddenLines).toBe(1);
    expect(res.body.makeability.canBeMade).toBe(false);
    expect(JSON.stringify(res.body)).not.toContain(theirs.code);
    expect((await request(t.app).get(`/api/products/${foreign.id}`).set(toolmaker.auth)).status).toBe(404);
    const list = await request(t.app).get('/api/products').query({ brandId: brand.id }).set(toolmaker.auth);
    expect(list.body.data.map((p: { id: string }) => p.id)).toEqual([shared.id]);
    expect(list.body.data[0].toolCodes).toEqual([mine.code]);
  });
});

describe('product list', () => {
  it('when searching and filtering, then SKU, name and tool code match, filters combine, and pages follow the SKU order', async () => {
    const { brand, factory, engineer } = await world();
    const prefix = `PX${uid().slice(0, 5).toUpperCase()}`;
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const part = await makePart(tool.id);
    const a = await makeProduct(brand.id, { sku: `${prefix}-A`, status: 'in_line' });
    const b = await makeProduct(brand.id, { sku: `${prefix}-B`, status: 'retired' });
    const c = await makeProduct(brand.id, { sku: `${prefix}-C`, status: 'in_line', name: 'Storm Kite' });
    const viaTool = await makeProduct(brand.id, { status: 'in_line' });
    await bind(viaTool.id, part, 1);

    const bySku = await request(t.app).get('/api/products').query({ q: prefix.toLowerCase() }).set(engineer.auth);
    expect(bySku.body.data.map((p: { id: string }) => p.id)).toEqual([a.id, b.id, c.id]);
    const combined = await request(t.app).get('/api/products').query({ q: prefix, status: 'in_line', brandId: brand.id }).set(engineer.auth);
    expect(combined.body.data.map((p: { id: string }) => p.id)).toEqual([a.id, c.id]);
    const byTool = await request(t.app).get('/api/products').query({ q: tool.code }).set(engineer.auth);
    expect(byTool.body.data.map((p: { id: string }) => p.id)).toEqual([viaTool.id]);
    expect(byTool.body.data[0]).toMatchObject({ canBeMade: true, toolCodes: [tool.code] });
    const byToolId = await request(t.app).get('/api/products').query({ toolId: tool.id }).set(engineer.auth);
    expect(byToolId.body.data.map((p: { id: string }) => p.id)).toEqual([viaTool.id]);

    const page1 = await request(t.app).get('/api/products').query({ q: prefix, limit: 2 }).set(engineer.auth);
    expect(page1.body.data.map((p: { sku: string }) => p.sku)).toEqual([`${prefix}-A`, `${prefix}-B`]);
    await makeProduct(brand.id, { sku: `${prefix}-AA` }); // lands before the cursor: not on the next page
    const page2 = await request(t.app).get('/api/products').query({ q: prefix, limit: 2, cursor: page1.body.meta.nextCursor }).set(engineer.auth);
    expect(page2.body.data.map((p: { sku: string }) => p.sku)).toEqual([`${prefix}-C`]);
    expect(page2.body.meta.nextCursor).toBeNull();
  });
});

describe('writing products and bill lines', () => {
  it('when an engineer creates a product, then 201, SKU upper-cased, and an audit event', async () => {
    const { brand, engineer } = await world();
    const sku = `sr-${uid()}`;
    const res = await request(t.app)
      .post('/api/products')
      .set(engineer.auth)
      .send({ sku, name: 'Storm Kite', brandId: brand.id, status: 'in_line', fobCents: 325, wholesaleCents: 680, retailCents: 1399, plannedUnits: 60000 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ sku: sku.toUpperCase(), fobCents: 325, wholesaleCents: 680, retailCents: 1399, currency: 'USD', version: 0 });
    expect(await AuditEventModel.count({ where: { entity: 'product', entityId: res.body.id, action: 'product.create' } })).toBe(1);
    const dup = await request(t.app).post('/api/products').set(engineer.auth).send({ sku, name: 'Again', brandId: brand.id });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fieldErrors).toHaveProperty('sku');
  });

  it('when money is negative or not whole cents, or retail is below wholesale, then 400 per field', async () => {
    const { brand, engineer } = await world();
    const res = await request(t.app)
      .post('/api/products')
      .set(engineer.auth)
      .send({ sku: code('P'), name: 'x', brandId: brand.id, fobCents: -1, wholesaleCents: 10.5, plannedUnits: -3 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['fobCents', 'plannedUnits', 'wholesaleCents']);
    const order = await request(t.app).post('/api/products').set(engineer.auth).send({ sku: code('P'), name: 'x', brandId: brand.id, wholesaleCents: 700, retailCents: 600 });
    expect(order.status).toBe(400);
    expect(order.body.error.fieldErrors).toHaveProperty('retailCents');
  });

  it('when two people edit one product from the same version, then the second gets 409 stale_version', async () => {
    const { brand, engineer } = await world();
    const product = await makeProduct(brand.id);
    expect((await request(t.app).patch(`/api/products/${product.id}`).set(engineer.auth).send({ version: 0, status: 'retired' })).status).toBe(200);
    const stale = await request(t.app).patch(`/api/products/${product.id}`).set(engineer.auth).send({ version: 0, plannedUnits: 5 });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'stale_version', current: { status: 'retired', version: 1 } });
  });

  it.each(['designer', 'brand_lead', 'toolmaker'] as const)('when a %s writes products or bill lines, then 403', async (role) => {
    const { brand, factory } = await world();
    const user = await makeUser(role, { factoryId: role === 'toolmaker' ? factory.id : undefined });
    const product = await makeProduct(brand.id);
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const part = await makePart(tool.id);
    expect((await request(t.app).post('/api/products').set(user.auth).send({ sku: code('P'), name: 'x', brandId: brand.id })).status).toBe(403);
    expect((await request(t.app).patch(`/api/products/${product.id}`).set(user.auth).send({ version: 0, name: 'y' })).status).toBe(403);
    expect((await request(t.app).post(`/api/products/${product.id}/bill`).set(user.auth).send({ partId: part.id })).status).toBe(403);
    expect((await request(t.app).post(`/api/tools/${tool.id}/parts`).set(user.auth).send({ name: 'x', resin: 'ABS', cavitiesPerShot: 1 })).status).toBe(403);
    expect((await request(t.app).patch(`/api/parts/${part.id}`).set(user.auth).send({ resin: 'PP' })).status).toBe(403);
    expect(await BillOfPartsModel.count({ where: { productId: product.id } })).toBe(0);
  });

  it('when binding a part, then the current revision is the default; a revision the tool does not have is 400; twice is 409; a disposed tool is 409', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, currentRevision: 2 });
    const part = await makePart(tool.id, 'Head');
    const product = await makeProduct(brand.id);
    const res = await request(t.app).post(`/api/products/${product.id}/bill`).set(engineer.auth).send({ partId: part.id, quantityPerUnit: 2 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ productId: product.id, partId: part.id, toolId: tool.id, revision: 2, quantityPerUnit: 2 });
    expect((await request(t.app).post(`/api/products/${product.id}/bill`).set(engineer.auth).send({ partId: part.id })).status).toBe(409);
    const other = await makeProduct(brand.id);
    const bad = await request(t.app).post(`/api/products/${other.id}/bill`).set(engineer.auth).send({ partId: part.id, revision: 3 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.revision[0]).toMatch(/from 1 to 2/);
    const moved = await request(t.app).patch(`/api/bill-entries/${res.body.id}`).set(engineer.auth).send({ revision: 1 });
    expect(moved.body.revision).toBe(1);
    const disposed = await makeTool({ brandId: brand.id, factoryId: factory.id, status: 'disposed' });
    const oldPart = await makePart(disposed.id, 'Head');
    const refused = await request(t.app).post(`/api/products/${other.id}/bill`).set(engineer.auth).send({ partId: oldPart.id });
    expect(refused.status).toBe(409);
    expect((await request(t.app).delete(`/api/bill-entries/${res.body.id}`).set(engineer.auth)).status).toBe(204);
    const audit = await AuditEventModel.findOne({ where: { entity: 'bill_line', entityId: res.body.id, action: 'bill_line.delete' } });
    expect(audit?.before).toMatchObject({ revision: 1, quantityPerUnit: 2 });
    expect(await ProductModel.count({ where: { id: product.id } })).toBe(1);
  });

  it('when a part name is taken on the tool, or its cavities exceed the tool, then 409 / 400', async () => {
    const { brand, factory, engineer } = await world();
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id, cavityCount: 2 });
    const first = await request(t.app).post(`/api/tools/${tool.id}/parts`).set(engineer.auth).send({ name: 'Head', resin: 'ABS', cavitiesPerShot: 1 });
    expect(first.status).toBe(201);
    expect((await request(t.app).post(`/api/tools/${tool.id}/parts`).set(engineer.auth).send({ name: 'Head', resin: 'ABS', cavitiesPerShot: 1 })).status).toBe(409);
    const tooMany = await request(t.app).post(`/api/tools/${tool.id}/parts`).set(engineer.auth).send({ name: 'Visor', resin: 'PC', cavitiesPerShot: 2 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fieldErrors.cavitiesPerShot[0]).toMatch(/At most 1/);
    const edit = await request(t.app).patch(`/api/parts/${first.body.id}`).set(engineer.auth).send({ cavitiesPerShot: 2, resin: 'POM' });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ cavitiesPerShot: 2, resin: 'POM' });
  });
});
