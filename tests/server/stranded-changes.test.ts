import { ChangeRequestModel, ToolModel } from '../../server/models';
import { openTestApp, request } from './helpers';
import { makeScene } from './request-fixtures';
import { actWith, requestIn } from './workflow-fixtures';

const t = openTestApp();
afterAll(() => t.close());
const act = actWith(t.app);

const TOOL_HEADER = 'code,name,brand_code,factory,construction,mold_class,rated_shots,rated_shots_source,cavity_count,weight_kg,build_cost,currency,build_date,shot_count,last_run_date,status,storage_location';

describe('a change cleared to cut holds its tool', () => {
  it('when a change is cleared to cut, then the tool cannot be set back to active, nor scrapped or sold', async () => {
    const s = await makeScene();
    await requestIn(t.app, s, 'cut_authorized');
    const tool = (await ToolModel.findByPk(s.tool.id))!;
    expect(tool.status).toBe('in_change');

    const back = await request(t.app).patch(`/api/tools/${tool.id}`).set(s.users.engineer.auth).send({ version: tool.version, status: 'active' });
    expect(back.status).toBe(409);
    expect(back.body.error.message).toMatch(/stays "being changed" until change CR-\d{4}/);
    for (const decision of ['scrap', 'sell']) {
      const gone = await request(t.app).post(`/api/tools/${tool.id}/retention-decision`).set(s.users.engineer.auth).send({ version: tool.version, decision, note: 'Worn out' });
      expect(gone.status).toBe(409);
    }
    const csv = `${TOOL_HEADER}\n${tool.code},${tool.name},${s.brand.code},${s.factory.name},${tool.construction},${tool.moldClass},,,${tool.cavityCount},,,,,,,active,`;
    const dry = await request(t.app).post('/api/registry/import').query({ kind: 'tools', dryRun: 'true' }).set(s.users.engineer.auth).set('content-type', 'text/csv').send(csv);
    expect(dry.body.rows[0].errors).toEqual([{ column: 'status', message: expect.stringMatching(/Stays in_change until change CR-/) }]);
    expect((await ToolModel.findByPk(tool.id))!.status).toBe('in_change');
  });

  it('when two changes are cleared on one tool and the first closes, then the tool stays being changed and cannot be sold', async () => {
    const s = await makeScene();
    const first = await requestIn(t.app, s, 'cut_authorized');
    const second = await requestIn(t.app, s, 'cut_authorized');
    // The cut and the first acceptance are set up directly (their own checks are tested elsewhere);
    // the last acceptance, which closes the change and revises the tool, goes through the API.
    await ChangeRequestModel.update({ status: 'samples_review', acceptedByRoles: ['designer'] }, { where: { id: first } });
    const closing = await act(s.users.engineer, first, 'accept_samples');
    expect([closing.status, closing.body.request?.status]).toEqual([201, 'closed']);
    const tool = (await ToolModel.findByPk(s.tool.id))!;
    expect(tool.status).toBe('in_change');
    const sell = await request(t.app).post(`/api/tools/${tool.id}/retention-decision`).set(s.users.engineer.auth).send({ version: tool.version, decision: 'sell', note: 'Buyer found' });
    expect(sell.status).toBe(409);
    expect(sell.body.error.message).toMatch(/close or cancel change CR-/);
    // The second change still has its next step.
    const next = await request(t.app).get(`/api/requests/${second}`).set(s.users.engineer.auth);
    expect(next.body.status).toBe('cut_authorized');
  });
});
