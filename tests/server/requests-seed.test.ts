import sharp from 'sharp';
import { signSessionToken } from '../../server/lib/tokens';
import { AttachmentModel, BillOfPartsModel, ChangeRequestModel, SignOffModel, ToolModel, ToolRevisionModel, UserModel } from '../../server/models';
import { seedDemo } from '../../server/seed/run';
import { demoRequests } from '../../server/seed/requests';
import { workflowDemoRequests } from '../../server/seed/workflow';
import { openTestApp, request } from './helpers';

const t = openTestApp();
afterAll(() => t.close());

async function authAs(email: string) {
  const u = (await UserModel.findOne({ where: { email } }))!;
  return { Authorization: `Bearer ${await signSessionToken(u.id, u.role)}` };
}

describe('demo change requests', () => {
  beforeAll(async () => {
    await seedDemo(t.sequelize);
  }, 60_000);

  it('when the demo is seeded twice, then the requests and their images are not repeated', async () => {
    const titles = demoRequests.map((r) => r.title);
    const count = () => ChangeRequestModel.count({ where: { title: titles } });
    const files = async () => AttachmentModel.count({ where: { requestId: (await ChangeRequestModel.findAll({ where: { title: titles } })).map((r) => r.id) } });
    const before = [await count(), await files()];
    await seedDemo(t.sequelize);
    expect([await count(), await files()]).toEqual(before);
    expect(before).toEqual([3, 6]);
  }, 60_000);

  it('when the Starling Rangers brand lead opens the visor-ridge request, then it is in engineering review, cannot be undone and ends Ranger Kite', async () => {
    const row = (await ChangeRequestModel.findOne({ where: { title: demoRequests[0]!.title } }))!;
    const res = await request(t.app).get(`/api/requests/${row.id}`).set(await authAs('brandlead@kestrelbay.example'));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'engineering_review', irreversible: true, endedProductCount: 1, retestRequired: true, tool: { code: 'KB-T-0412' } });
    expect(res.body.derivativeProduct).toMatchObject({ sku: 'SR-1002', name: 'Storm Kite' });
    expect(res.body.impact.endedProducts.map((p: { sku: string; status: string }) => [p.sku, p.status])).toEqual([['SR-1001', 'reissue_planned']]);
    expect(res.body.items[0]).toMatchObject({ partName: 'Head', steel: { steelAction: 'remove', undoPath: 'reweld_and_recut' } });
    expect(res.body.attachments.map((a: { kind: string }) => a.kind)).toEqual(['before', 'after']);
    const img = await request(t.app).get(res.body.attachments[1].url).set(await authAs('designer@kestrelbay.example')).buffer(true);
    expect(img.status).toBe(200);
    expect((await sharp(img.body as Buffer).metadata()).format).toBe('png');
    // The Mudlark Racers lead does not see a Starling Rangers request.
    expect((await request(t.app).get(`/api/requests/${row.id}`).set(await authAs('racerslead@kestrelbay.example'))).status).toBe(404);
  });

  it('when the insert swap and the panel-line drafts are read, then neither ends a product (swap back; reissue moved)', async () => {
    const auth = await authAs('engineer@kestrelbay.example');
    for (const spec of demoRequests.slice(1)) {
      const row = (await ChangeRequestModel.findOne({ where: { title: spec.title } }))!;
      const res = await request(t.app).get(`/api/requests/${row.id}`).set(auth);
      expect(res.body.status).toBe('draft');
      expect(res.body.impact.endedProducts).toEqual([]);
    }
    const swap = (await ChangeRequestModel.findOne({ where: { title: demoRequests[1]!.title } }))!;
    expect(swap.irreversible).toBe(false);
    const panels = (await ChangeRequestModel.findOne({ where: { title: demoRequests[2]!.title } }))!;
    const res = await request(t.app).get(`/api/requests/${panels.id}`).set(auth);
    expect(res.body.irreversible).toBe(true);
    expect(res.body.impact.keptProducts.map((p: { sku: string }) => p.sku)).toEqual(['MR-2002']);
  });
  it('when the demo is seeded, then there are requests in every state, each reached through real sign-offs whose chain verifies', async () => {
    const auth = await authAs('admin@kestrelbay.example');
    const titles = [...demoRequests, ...workflowDemoRequests].map((r) => r.title);
    const rows = await ChangeRequestModel.findAll({ where: { title: titles } });
    expect(new Set(rows.map((r) => r.status))).toEqual(
      new Set(['draft', 'engineering_review', 'brand_approval', 'cut_authorized', 'samples_review', 'closed', 'declined', 'withdrawn']),
    );
    for (const spec of [...demoRequests, ...workflowDemoRequests]) {
      const row = rows.find((r) => r.title === spec.title)!;
      expect([spec.title, row.status]).toEqual([spec.title, spec.status]);
      expect(await SignOffModel.count({ where: { requestId: row.id } })).toBe(spec.history?.length ?? 0);
      const v = await request(t.app).get(`/api/requests/${row.id}/sign-offs/verify`).set(auth);
      expect([spec.title, v.body.intact]).toEqual([spec.title, true]);
    }
    // The demo head re-cut was submitted by the designer, ready for the engineer.
    const head = rows.find((r) => r.title === demoRequests[0]!.title)!;
    const list = await request(t.app).get(`/api/requests/${head.id}/sign-offs`).set(auth);
    expect(list.body.data.map((x: { action: string; signer: { printedName: string } }) => [x.action, x.signer.printedName])).toEqual([['submit', 'Wren Okafor']]);
    const inbox = await request(t.app).get('/api/inbox').set(await authAs('engineer@kestrelbay.example'));
    expect(inbox.body.data.map((i: { id: string }) => i.id)).toContain(head.id);
    // The Starling Rangers lead has the overdue Osprey texture waiting, overdue and first.
    const lead = await request(t.app).get('/api/inbox').set(await authAs('brandlead@kestrelbay.example'));
    expect(lead.body.data[0]).toMatchObject({ title: 'Deeper feather texture on the Osprey wings', overdue: true, waitingFor: ['approve', 'return', 'decline'] });
  });

  it('when the chassis rib was seeded as closed, then the chassis tool is at revision 2 made by it, and the moved vehicles are bound to it', async () => {
    const closed = (await ChangeRequestModel.findOne({ where: { title: 'Stiffening rib under the Dune Buggy chassis' } }))!;
    const tool = (await ToolModel.findByPk(closed.toolId))!;
    expect(tool).toMatchObject({ code: 'KB-T-0510', currentRevision: 2, status: 'active' });
    expect(await ToolRevisionModel.findOne({ where: { toolId: tool.id, number: 2 } })).toMatchObject({ changeRequestId: closed.id });
    const lines = await BillOfPartsModel.findAll({ where: { toolId: tool.id } });
    expect(new Set(lines.map((l) => l.revision))).toEqual(new Set([2]));
    const released = (await ChangeRequestModel.findOne({ where: { title: 'Anniversary logo on a replacement display-stand insert' } }))!;
    expect((await ToolModel.findByPk(released.toolId))!.status).toBe('in_change');
    // Seeding again adds no sign-off.
    const before = await SignOffModel.count();
    await seedDemo(t.sequelize);
    expect(await SignOffModel.count()).toBe(before);
  }, 60_000);
});
