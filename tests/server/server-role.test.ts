// The server's database role: the whole sign-off flow works under it, and it cannot lift the
// guards of the record.
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db';
import { serverRoleUrl } from '../../server/db/roles';
import { initModels } from '../../server/models';
import { TEST_DATABASE_URL, request } from './helpers';
import { makeScene } from './request-fixtures';
import { requestIn } from './workflow-fixtures';

const sequelize = createSequelize(serverRoleUrl(TEST_DATABASE_URL));
initModels(sequelize);
const app = createApp({ sequelize, logLevel: 'silent', signInLimitPerIp: 10_000 });
afterAll(() => sequelize.close());

describe('the server role', () => {
  it('when the server runs as its own role, then a request goes to cleared to cut and its record checks intact', async () => {
    const [[who]] = (await sequelize.query('SELECT current_user AS u')) as [[{ u: string }], unknown];
    expect(who.u).toBe('toolgate_server');
    const s = await makeScene();
    const id = await requestIn(app, s, 'cut_authorized');
    const v = await request(app).get(`/api/requests/${id}/sign-offs/verify`).set(s.users.lead.auth);
    expect(v.body).toMatchObject({ intact: true, checked: 3 });
  });

  it.each([
    ['switch the sign-off guard off', 'ALTER TABLE sign_offs DISABLE TRIGGER sign_offs_no_update', /must be owner/],
    ['switch the audit guard off', 'ALTER TABLE audit_events DISABLE TRIGGER USER', /must be owner/],
    ['rewrite a sign-off', "UPDATE sign_offs SET printed_name = 'x'", /permission denied/],
    ['rewrite an audit event', "UPDATE audit_events SET actor_name = 'x'", /permission denied/],
    ['delete an audit event', 'DELETE FROM audit_events', /permission denied/],
    ['truncate the sign-offs', 'TRUNCATE sign_offs', /permission denied/],
    ['rewrite the membership history', "UPDATE membership_history SET role = 'admin'", /permission denied/],
    ['drop the guard trigger', 'DROP TRIGGER sign_offs_no_update ON sign_offs', /must be owner/],
    ['take ownership', 'ALTER TABLE sign_offs OWNER TO toolgate_server', /must be owner/],
  ])('when the server role tries to %s, then the database refuses', async (_what, sql, message) => {
    await expect(sequelize.query(sql)).rejects.toMatchObject({ message: expect.stringMatching(message) });
  });
});
