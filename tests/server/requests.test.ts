import { AuditEventModel, ChangeItemModel, ChangeRequestModel, ProductModel } from '../../server/models';
import { impactContextSchema, requestDetailSchema, requestListResponseSchema } from '../../shared/schemas/change-requests';
import { makeFactory, makeUser, openTestApp, request, uid } from './helpers';
import { makeTool } from './registry-helpers';
import { createDraft, insertItem, makeScene, putInState, ridgeItem } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

const get = (s: { auth: Record<string, string> }, path: string) => request(t.app).get(path).set(s.auth);
const patch = (s: { auth: Record<string, string> }, id: string, body: Record<string, unknown>) => request(t.app).patch(`/api/requests/${id}`).set(s.auth).send(body);
const ids = (xs: { id: string }[]) => xs.map((x) => x.id).sort();

// The expected impacts follow the trade rule of DESIGN section 5 (common practice, no published
// source): steel cut out of a tool cannot be put back, so every product still needing the part at the
// tool's current revision is ended unless moved to the new revision; a retired product is not
// ended; a replacement insert keeps the current insert, so it ends nothing.

describe('create a request', () => {
  it('when a designer proposes an irreversible cut, then 201 with the steel direction, the ended products and the stored results', async () => {
    const s = await makeScene();
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({ toolId: s.tool.id, title: 'Raised visor ridge', reason: 'For the derivative', derivativeProductId: s.products.storm.id, items: [ridgeItem(s.head.id)] });
    expect(res.status).toBe(201);
    const d = res.body;
    // The app parses every answer with the shared contract: the server must keep to it.
    expect(() => requestDetailSchema.parse(d)).not.toThrow();
    expect(d).toMatchObject({ title: 'Raised visor ridge', status: 'draft', version: expect.any(Number), irreversible: true, endedProductCount: 2 });
    expect(d.ref).toBe(`CR-${String(d.number).padStart(4, '0')}`);
    expect(d.submitter).toEqual({ id: s.users.designer.user.id, name: s.users.designer.user.name });
    expect(d.brand).toEqual({ id: s.brand.id, name: s.brand.name });
    expect(d.tool).toMatchObject({ id: s.tool.id, code: s.tool.code, currentRevision: 1, factory: { id: s.factory.id } });
    expect(d.derivativeProduct).toEqual({ id: s.products.storm.id, sku: s.products.storm.sku, name: 'Storm Kite' });
    expect(d.items).toHaveLength(1);
    expect(d.items[0]).toMatchObject({ partId: s.head.id, partName: 'Head', size: '0.8', unit: 'mm', position: 0, steel: { steelAction: 'remove', undoPath: 'reweld_and_recut', irreversible: true } });
    // Ended: kite (reissue planned) and deluxe (in line) need the head at revision 1.
    expect(ids(d.impact.endedProducts)).toEqual(ids([s.products.kite, s.products.deluxe]));
    expect(d.impact.endedPlannedUnits).toBe(40_000 + 1000);
    // Heron needs the head but is retired; storm needs only the visor.
    const unaffected = Object.fromEntries(d.impact.unaffectedProducts.map((p: { id: string; reason: string }) => [p.id, p.reason]));
    expect(unaffected).toEqual({ [s.products.heron.id]: 'retired', [s.products.storm.id]: 'other_parts' });
    expect(d.permissions).toMatchObject({ canEdit: true, canEditItems: true, canUpload: true, actions: ['submit', 'withdraw'] });
    expect(d.retestRequired).toBe(false);

    const row = await ChangeRequestModel.findByPk(d.id);
    expect(row).toMatchObject({ irreversible: true, retestRequired: false, submitterId: s.users.designer.user.id });
    expect([...row!.endedProductIds].sort()).toEqual(ids([s.products.kite, s.products.deluxe]));
  });

  it('when a product is moved to the new revision, then it is kept, not ended', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { movedProductIds: [s.products.deluxe.id] });
    const impact = d.impact as { endedProducts: { id: string }[]; keptProducts: { id: string }[] };
    expect(ids(impact.endedProducts)).toEqual([s.products.kite.id]);
    expect(ids(impact.keptProducts)).toEqual([s.products.deluxe.id]);
    expect(d.endedProductCount).toBe(1);
    expect(d.movedProductIds).toEqual([s.products.deluxe.id]);
  });

  it('when the only item swaps an insert, then the request can be undone and ends nothing', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { items: [insertItem(s.visor.id)] });
    expect(d.irreversible).toBe(false);
    expect((d.impact as { endedProducts: unknown[] }).endedProducts).toEqual([]);
    expect((d.items as unknown as { steel: { undoPath: string } }[])[0]!.steel.undoPath).toBe('swap_back');
  });

  it('when an item carries a safety flag, then the request records that a re-test is required, with the cautions', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { items: [ridgeItem(s.head.id, { safetyFlags: ['point_or_edge'] })] });
    expect(d.retestRequired).toBe(true);
    const safety = d.safety as { cautions: { flag: string; references: { id: string; value: string; unit: string }[] }[] };
    expect(safety.cautions.map((c) => c.flag)).toEqual(['point_or_edge']);
    // 16 CFR 1500.48: the sharp-point tester presses with 1 pound-force.
    expect(safety.cautions[0]!.references[0]).toMatchObject({ value: '1.00', unit: 'lbf' });
    expect((await ChangeRequestModel.findByPk(d.id))!.retestRequired).toBe(true);
  });

  it('when the designer creates the derivative inline, then the product is made in the tool brand, in line, with 0 planned units, and audited', async () => {
    const s = await makeScene();
    const sku = `NEW-${uid().toUpperCase()}`;
    const d = await createDraft(t.app, s, { newDerivative: { sku, name: 'Storm Kite Mk II' } });
    const product = await ProductModel.findOne({ where: { sku } });
    expect(product).toMatchObject({ brandId: s.brand.id, status: 'in_line', plannedUnits: 0, name: 'Storm Kite Mk II' });
    expect(d.derivativeProduct).toEqual({ id: product!.id, sku, name: 'Storm Kite Mk II' });
    expect(await AuditEventModel.count({ where: { action: 'product.create', entityId: product!.id } })).toBe(1);
  });

  it('when the inline derivative SKU is taken, then 409 on newDerivative.sku and neither request nor product is saved', async () => {
    const s = await makeScene();
    const title = `Clash ${uid()}`;
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({ toolId: s.tool.id, title, newDerivative: { sku: s.products.storm.sku, name: 'Duplicate' } });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors).toHaveProperty(['newDerivative.sku']);
    expect(await ChangeRequestModel.count({ where: { title } })).toBe(0);
  });

  it('when both an existing derivative and a new one are given, then 400 on newDerivative', async () => {
    const s = await makeScene();
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({ toolId: s.tool.id, title: 'Both ways', derivativeProductId: s.products.storm.id, newDerivative: { sku: `X-${uid()}`, name: 'Other' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('newDerivative');
  });

  it('when items are bad, then 400 with fieldErrors per item and nothing is saved', async () => {
    const s = await makeScene();
    const title = `Bad items ${uid()}`;
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({
        toolId: s.tool.id,
        title,
        items: [
          ridgeItem(s.head.id, { effect: 'loses_plastic' }), // a cut cannot take plastic away
          ridgeItem(s.head.id, { size: '0,8' }),
          ridgeItem(s.head.id, { size: '0' }),
          { effect: 'gains_plastic', method: 'cut', size: '1', unit: 'mm' },
          ridgeItem(s.head.id, { unit: 'cm', safetyFlags: ['small_part', 'small_part'] }),
          ridgeItem(s.head.id, { region: { imageRole: 'after', shape: 'box', x: 0.8, y: 0.1, w: 0.5, h: 0.2 } }),
        ],
      });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(
      ['items.0.method', 'items.1.size', 'items.2.size', 'items.3.partId', 'items.4.unit', 'items.4.safetyFlags', 'items.5.region.w'].sort(),
    );
    expect(await ChangeRequestModel.count({ where: { title } })).toBe(0);
  });

  it('when an item names a part of another tool, then 400 on items.N.partId and nothing is saved', async () => {
    const s = await makeScene();
    const title = `Wrong part ${uid()}`;
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({ toolId: s.tool.id, title, items: [ridgeItem(s.head.id), ridgeItem(s.otherPart.id)] });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({ 'items.1.partId': [`Pick a part of tool ${s.tool.code}`] });
    expect(await ChangeRequestModel.count({ where: { title } })).toBe(0);
  });

  it('when a moved product is not made from the tool, then 400 on movedProductIds.N', async () => {
    const s = await makeScene();
    const res = await request(t.app)
      .post('/api/requests')
      .set(s.users.designer.auth)
      .send({ toolId: s.tool.id, title: 'Moves a stranger', movedProductIds: [s.products.unrelated.id] });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty(['movedProductIds.0']);
  });

  it('when the tool does not exist or is disposed, then 400 on toolId or 409 wrong_state', async () => {
    const s = await makeScene();
    const missing = await request(t.app).post('/api/requests').set(s.users.designer.auth).send({ toolId: '00000000-0000-4000-8000-000000000000', title: 'No such tool' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fieldErrors).toHaveProperty('toolId');
    const disposed = await makeTool({ brandId: s.brand.id, factoryId: s.factory.id, status: 'disposed' });
    const res = await request(t.app).post('/api/requests').set(s.users.designer.auth).send({ toolId: disposed.id, title: 'Cut a scrapped tool' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_state');
  });

  it('when a target date is not a real date, then 400 on targetDate', async () => {
    const s = await makeScene();
    const res = await request(t.app).post('/api/requests').set(s.users.designer.auth).send({ toolId: s.tool.id, title: 'Leap day', targetDate: '2027-02-29' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('targetDate');
  });

  it.each(['engineer', 'brand_lead', 'toolmaker', 'admin'] as const)('when a %s tries to create a request, then 403', async (role) => {
    const s = await makeScene();
    const user = await makeUser(role, role === 'toolmaker' ? { factoryId: s.factory.id } : { brandIds: [s.brand.id] });
    const res = await request(t.app).post('/api/requests').set(user.auth).send({ toolId: s.tool.id, title: 'Not mine to propose' });
    expect(res.status).toBe(403);
  });

  it('when nobody is signed in, then 401', async () => {
    expect((await request(t.app).get('/api/requests')).status).toBe(401);
  });

  it('when created, then the audit trail holds the request with its items as "after"', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const audit = await AuditEventModel.findOne({ where: { action: 'change_request.create', entityId: d.id } });
    expect(audit).toMatchObject({ actorId: s.users.designer.user.id, before: null });
    expect(audit!.after).toMatchObject({ title: d.title, irreversible: true, items: [{ partId: s.head.id, method: 'cut', size: '0.8' }] });
  });
});

describe('edit a draft', () => {
  it('when the submitter edits the title and items, then 200, the version moves on, kept items keep their id, and the audit has before and after', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const itemId = d.items[0]!.id;
    const res = await patch(s.users.designer, d.id, {
      version: d.version,
      title: 'Ridge and new visor',
      items: [ridgeItem(s.head.id, { id: itemId, size: '1.25' }), insertItem(s.visor.id)],
    });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(d.version + 1);
    expect(res.body.items.map((i: { id: string }) => i.id)[0]).toBe(itemId);
    expect(res.body.items.map((i: { size: string; position: number }) => [i.size, i.position])).toEqual([['1.25', 0], ['12.5', 1]]);
    const audit = await AuditEventModel.findOne({ where: { action: 'change_request.update', entityId: d.id } });
    expect(audit!.before).toMatchObject({ title: d.title, items: [{ id: itemId, size: '0.8' }] });
    expect(audit!.after).toMatchObject({ title: 'Ridge and new visor', items: [{ id: itemId, size: '1.25' }, { partId: s.visor.id }] });
  });

  it('when an item is left out of the list, then it is removed; an unknown item id is 400', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { items: [ridgeItem(s.head.id), insertItem(s.visor.id)] });
    const res = await patch(s.users.designer, d.id, { version: d.version, items: [insertItem(s.visor.id, { id: d.items[1]!.id })] });
    expect(res.status).toBe(200);
    expect(await ChangeItemModel.count({ where: { requestId: d.id } })).toBe(1);
    expect(res.body.version).toBe(d.version + 1); // a change to the items alone moves the version on
    expect(res.body.irreversible).toBe(false);
    expect((await ChangeRequestModel.findByPk(d.id))!.endedProductIds).toEqual([]);
    const bad = await patch(s.users.designer, d.id, { version: res.body.version, items: [insertItem(s.visor.id, { id: d.items[0]!.id })] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty(['items.0.id']);
  });

  it('when a field is left out, then it is kept (the reason is not wiped)', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { reason: 'Keep me' });
    const res = await patch(s.users.designer, d.id, { version: d.version, title: 'Only the title changes' });
    expect(res.status).toBe(200);
    expect(res.body.reason).toBe('Keep me');
    expect(res.body.items).toHaveLength(1);
  });

  it('when nothing really changes, then 200 and the version stays', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const res = await patch(s.users.designer, d.id, { version: d.version, title: d.title });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(d.version);
  });

  it('when the version is stale, then 409 stale_version with the current copy, and the newer edit is kept', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const first = await patch(s.users.designer, d.id, { version: d.version, title: 'First edit wins' });
    expect(first.status).toBe(200);
    const second = await patch(s.users.designer, d.id, { version: d.version, title: 'Stale edit' });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('stale_version');
    expect(second.body.error.current).toMatchObject({ id: d.id, title: 'First edit wins', version: first.body.version });
    expect(() => requestDetailSchema.parse(second.body.error.current)).not.toThrow();
    expect((await ChangeRequestModel.findByPk(d.id))!.title).toBe('First edit wins');
  });

  it('when two edits race with the same version, then exactly one wins and the other gets 409', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    const results = await Promise.all(['Edit A', 'Edit B'].map((title) => patch(s.users.designer, d.id, { version: d.version, title })));
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = results.find((r) => r.status === 200)!.body.title;
    expect((await ChangeRequestModel.findByPk(d.id))!.title).toBe(winner);
  });

  it('when another designer edits the draft, then 403; an engineer on a draft, 409; other roles, 403', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    expect((await patch(s.users.otherDesigner, d.id, { version: d.version, title: 'Not my draft' })).status).toBe(403);
    const eng = await patch(s.users.engineer, d.id, { version: d.version, items: [] });
    expect(eng.status).toBe(409);
    expect(eng.body.error.code).toBe('wrong_state');
    for (const u of [s.users.lead, s.users.admin, s.users.toolmaker]) {
      expect((await patch(u, d.id, { version: d.version, title: 'Nope' })).status).toBe(403);
    }
    expect((await ChangeRequestModel.findByPk(d.id))!.title).toBe(d.title);
  });

  it('when the request is in engineering review, then the engineer may change items, moved products and reason but not the title, and the designer may not edit', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    await putInState(d.id, 'engineering_review');
    const view = await get(s.users.engineer, `/api/requests/${d.id}`);
    expect(view.body.permissions).toMatchObject({ canEdit: false, canEditItems: true, editableFields: ['items', 'movedProductIds', 'reason'], actions: ['sign_review', 'return_to_draft'] });

    const ok = await patch(s.users.engineer, d.id, {
      version: d.version,
      title: d.title, // unchanged values may be resent
      reason: 'Engineer: ridge depth checked against the shrink',
      items: [ridgeItem(s.head.id, { id: d.items[0]!.id, size: '0.6' })],
      movedProductIds: [s.products.deluxe.id],
    });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ reason: 'Engineer: ridge depth checked against the shrink', endedProductCount: 1 });

    const title = await patch(s.users.engineer, d.id, { version: ok.body.version, title: 'Engineer renames it' });
    expect(title.status).toBe(403);
    expect(title.body.error.fieldErrors).toHaveProperty('title');
    const designer = await patch(s.users.designer, d.id, { version: ok.body.version, title: 'Designer during review' });
    expect(designer.status).toBe(409);
    expect(designer.body.error.code).toBe('wrong_state');
  });

  it('when the tool has been disposed since, then the draft is read-only (409 wrong_state)', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    await s.tool.update({ status: 'disposed', retentionDecision: 'scrap', retentionDecidedAt: new Date() });
    const res = await patch(s.users.designer, d.id, { version: d.version, title: 'Too late' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_state');
    expect((await get(s.users.designer, `/api/requests/${d.id}`)).body.permissions).toMatchObject({ canEdit: false, canUpload: false, editableFields: [] });
  });

  it('when the id is unknown or not a uuid, then 404', async () => {
    const s = await makeScene();
    expect((await patch(s.users.designer, '00000000-0000-4000-8000-000000000000', { version: 0 })).status).toBe(404);
    expect((await get(s.users.designer, '/api/requests/not-an-id')).status).toBe(404);
  });
});

describe('who sees a request', () => {
  it('when company roles open a draft, then 200; a brand lead of another brand and any toolmaker get 404', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    for (const u of [s.users.designer, s.users.otherDesigner, s.users.engineer, s.users.admin, s.users.lead]) {
      expect((await get(u, `/api/requests/${d.id}`)).status).toBe(200);
    }
    for (const u of [s.users.otherLead, s.users.toolmaker, s.users.otherToolmaker]) {
      const res = await get(u, `/api/requests/${d.id}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('when a request is cleared to cut, then the toolmaker of its factory sees it and may record the cut; another factory still gets 404', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    for (const status of ['engineering_review', 'brand_approval'] as const) {
      await putInState(d.id, status);
      expect((await get(s.users.toolmaker, `/api/requests/${d.id}`)).status).toBe(404);
    }
    await putInState(d.id, 'cut_authorized');
    const res = await get(s.users.toolmaker, `/api/requests/${d.id}`);
    expect(res.status).toBe(200);
    expect(res.body.permissions).toMatchObject({ canEdit: false, canEditItems: false, canUpload: true, uploadKinds: ['sample'], actions: ['confirm_receipt', 'record_cut'] });
    expect((await get(s.users.otherToolmaker, `/api/requests/${d.id}`)).status).toBe(404);
    for (const status of ['samples_review', 'closed'] as const) {
      await putInState(d.id, status);
      expect((await get(s.users.toolmaker, `/api/requests/${d.id}`)).status).toBe(200);
    }
    await putInState(d.id, 'withdrawn');
    expect((await get(s.users.toolmaker, `/api/requests/${d.id}`)).status).toBe(404);
  });

  it('when the brand lead opens a request awaiting brand sign-off, then they may approve, send back or decline; the admin may only withdraw', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s);
    await putInState(d.id, 'brand_approval');
    expect((await get(s.users.lead, `/api/requests/${d.id}`)).body.permissions.actions).toEqual(['approve', 'return', 'decline']);
    expect((await get(s.users.admin, `/api/requests/${d.id}`)).body.permissions.actions).toEqual(['withdraw']);
    expect((await get(s.users.designer, `/api/requests/${d.id}`)).body.permissions).toMatchObject({ canEdit: false, canUpload: false, actions: ['withdraw'] });
  });
});

describe('list requests', () => {
  async function listAll(u: { auth: Record<string, string> }, query: Record<string, string>) {
    const out: { id: string }[] = [];
    let cursor: string | null = null;
    do {
      const res = await get(u, '/api/requests').query({ ...query, ...(cursor ? { cursor } : {}) });
      expect(res.status).toBe(200);
      out.push(...res.body.data);
      cursor = res.body.meta.nextCursor;
    } while (cursor);
    return out;
  }

  it('when filtered by tool, then pages of the given size come newest first with no repeats', async () => {
    const s = await makeScene();
    const made: string[] = [];
    for (let i = 0; i < 5; i++) made.push((await createDraft(t.app, s, { title: `Page ${i} ${uid()}` })).id);
    const first = await get(s.users.engineer, '/api/requests').query({ toolId: s.tool.id, limit: 2 });
    expect(() => requestListResponseSchema.parse(first.body)).not.toThrow();
    expect(first.body.data).toHaveLength(2);
    expect(first.body.meta.nextCursor).toEqual(expect.any(String));
    expect(first.body.data[0]).toMatchObject({ tool: { id: s.tool.id, code: s.tool.code }, brand: { id: s.brand.id }, status: 'draft', irreversible: true, endedProductCount: 2 });
    const all = await listAll(s.users.engineer, { toolId: s.tool.id, limit: '2' });
    expect(all.map((r) => r.id)).toEqual([...made].reverse());
  });

  it('when a request is edited, then it moves to the top of the list', async () => {
    const s = await makeScene();
    const a = await createDraft(t.app, s);
    await createDraft(t.app, s);
    await patch(s.users.designer, a.id, { version: a.version, title: `Touched ${uid()}` });
    const res = await get(s.users.designer, '/api/requests').query({ toolId: s.tool.id });
    expect(res.body.data[0].id).toBe(a.id);
  });

  it('when filtered by status, mine, irreversible, brand and text, then only matching requests come back', async () => {
    const s = await makeScene();
    const cut = await createDraft(t.app, s, { title: `Ridge cut ${uid()}` });
    const swap = await createDraft(t.app, s, { title: `Visor swap ${uid()}`, items: [insertItem(s.visor.id)] });
    await putInState(swap.id, 'engineering_review');
    const other = await makeUser('designer');
    const theirs = await request(t.app).post('/api/requests').set(other.auth).send({ toolId: s.tool.id, title: `Someone else ${uid()}` });
    expect(theirs.status).toBe(201);

    const q = (query: Record<string, string>) => listAll(s.users.designer, { toolId: s.tool.id, ...query }).then((rows) => ids(rows));
    expect(await q({ status: 'engineering_review' })).toEqual([swap.id]);
    expect(await q({ mine: 'true' })).toEqual(ids([cut, swap]));
    expect(await q({ mine: 'false' })).toEqual([theirs.body.id]);
    expect(await q({ irreversible: 'true' })).toEqual([cut.id]);
    expect(await q({ irreversible: 'false' })).toEqual(ids([swap, theirs.body]));
    expect(await q({ q: 'visor SWAP' })).toEqual([swap.id]);
    expect(await q({ q: `CR-${String(cut.number).padStart(4, '0')}` })).toEqual([cut.id]);
    expect(await listAll(s.users.designer, { brandId: s.brand.id }).then((r) => r.length)).toBe(3);
    expect(await listAll(s.users.designer, { brandId: s.otherBrand.id })).toEqual([]);
  });

  it('when a brand lead or toolmaker lists, then they get only the requests they may see', async () => {
    const s = await makeScene();
    const draft = await createDraft(t.app, s);
    const released = await createDraft(t.app, s);
    await putInState(released.id, 'cut_authorized');
    const list = (u: { auth: Record<string, string> }) => listAll(u, { toolId: s.tool.id }).then(ids);
    expect(await list(s.users.lead)).toEqual(ids([draft, released]));
    expect(await list(s.users.otherLead)).toEqual([]);
    expect(await list(s.users.toolmaker)).toEqual([released.id]);
    expect(await list(s.users.otherToolmaker)).toEqual([]);
  });

  it('when the cursor or a filter is not valid, then 400', async () => {
    const s = await makeScene();
    expect((await get(s.users.designer, '/api/requests').query({ cursor: 'bm9wZQ' })).status).toBe(400);
    const forged = Buffer.from(JSON.stringify({ u: '2026-02-31 10:00:00+00', i: '00000000-0000-4000-8000-000000000000' })).toString('base64url');
    expect((await get(s.users.designer, '/api/requests').query({ cursor: forged })).status).toBe(400);
    expect((await get(s.users.designer, '/api/requests').query({ status: 'cut' })).status).toBe(400);
    expect((await get(s.users.designer, '/api/requests').query({ limit: '500' })).status).toBe(400);
  });
});

describe('impact context', () => {
  it('when the form asks for a tool, then it gets the tool, its parts, the products made from it and their bill lines', async () => {
    const s = await makeScene();
    const res = await get(s.users.designer, '/api/requests/impact-context').query({ toolId: s.tool.id });
    expect(res.status).toBe(200);
    expect(() => impactContextSchema.parse(res.body)).not.toThrow();
    expect(res.body.tool).toMatchObject({ id: s.tool.id, code: s.tool.code, currentRevision: 1, brandId: s.brand.id, factoryId: s.factory.id, weightKg: 300 });
    expect(res.body.parts.map((p: { name: string }) => p.name)).toEqual(['Head', 'Visor']);
    expect(ids(res.body.products)).toEqual(ids(Object.values(s.products).filter((p) => p !== s.products.unrelated)));
    expect(res.body.billOfParts).toHaveLength(5);
    expect(res.body.billOfParts[0]).toEqual({ productId: expect.any(String), partId: expect.any(String), toolId: s.tool.id, revision: 1, quantityPerUnit: 1 });
  });

  it('when a toolmaker of another factory asks, then 404; a missing toolId is 400', async () => {
    const s = await makeScene();
    expect((await get(s.users.otherToolmaker, '/api/requests/impact-context').query({ toolId: s.tool.id })).status).toBe(404);
    expect((await get(s.users.designer, '/api/requests/impact-context')).status).toBe(400);
  });
});

describe('a brand lead with no brands, and a toolmaker of a factory with nothing', () => {
  it('when they list, then the list is empty', async () => {
    const s = await makeScene();
    await createDraft(t.app, s);
    const lead = await makeUser('brand_lead');
    const maker = await makeUser('toolmaker', { factoryId: (await makeFactory()).id });
    for (const u of [lead, maker]) {
      const res = await get(u, '/api/requests').query({ toolId: s.tool.id });
      expect(res.body.data).toEqual([]);
    }
  });
});

