import sharp from 'sharp';
import { signSessionToken } from '../../server/lib/tokens';
import { AttachmentModel, ChangeRequestModel, UserModel } from '../../server/models';
import { seedDemo } from '../../server/seed/run';
import { demoRequests } from '../../server/seed/requests';
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
});
