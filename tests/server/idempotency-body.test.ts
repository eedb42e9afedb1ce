import { openTestApp, request } from './helpers';
import { makeScene } from './request-fixtures';
import { actWith, bodyFor, key, requestIn, signOffCount } from './workflow-fixtures';

const t = openTestApp();
afterAll(() => t.close());
const act = actWith(t.app);

describe('Idempotency-Key bound to the body it answered', () => {
  it('when a key is reused for the same action with a different body, then 422 and nothing new is written', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'engineering_review');
    const k = key();
    const body = await bodyFor(id, 'return_to_draft', { comment: 'Ridge depth is not given.' });
    const first = await request(t.app).post(`/api/requests/${id}/actions`).set(s.users.engineer.auth).set('Idempotency-Key', k).send(body);
    expect(first.status).toBe(201);
    const changed = await request(t.app)
      .post(`/api/requests/${id}/actions`)
      .set(s.users.engineer.auth)
      .set('Idempotency-Key', k)
      .send({ ...body, comment: 'Something else entirely.' });
    expect(changed.status).toBe(422);
    expect(changed.body.error).toMatchObject({ code: 'idempotency_mismatch', fieldErrors: { idempotencyKey: expect.any(Array) } });
    const same = await request(t.app).post(`/api/requests/${id}/actions`).set(s.users.engineer.auth).set('Idempotency-Key', k).send(body);
    expect(same.status).toBe(200);
    expect(same.body.signOff.id).toBe(first.body.signOff.id);
    expect(await signOffCount(id)).toBe(2);
  });

  it('when the same approval is retried, then the password is not part of what must match', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'brand_approval', 'ridge');
    const k = key();
    const first = await act(s.users.lead, id, 'approve', {}, k);
    expect(first.status).toBe(201);
    const retry = await request(t.app)
      .post(`/api/requests/${id}/actions`)
      .set(s.users.lead.auth)
      .set('Idempotency-Key', k)
      .send({ ...(await bodyFor(id, 'approve')), version: first.body.request.version - 1 });
    expect(retry.status).toBe(200);
  });
});
