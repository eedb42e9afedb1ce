// Tampering with the sign-off record as someone with direct database access would, and the
// record check finding it.
import { createHash } from 'node:crypto';
import { verifyResultSchema } from '../../shared/schemas/sign-offs';
import { canonicalJson } from '../../server/lib/canonical-json';
import { ChangeRequestModel, SignOffModel } from '../../server/models';
import { chainHash, GENESIS_HASH } from '../../server/services/sign-off-chain';
import { openTestApp, request } from './helpers';
import { makeScene } from './request-fixtures';
import { requestIn } from './workflow-fixtures';

const t = openTestApp();
afterAll(() => t.close());

const verify = async (auth: Record<string, string>, id: string) => {
  const res = await request(t.app).get(`/api/requests/${id}/sign-offs/verify`).set(auth);
  expect(res.status).toBe(200);
  return verifyResultSchema.parse(res.body);
};

/** As the tables' owner: the append-only triggers switched off inside one transaction. */
async function asOwner(statements: { sql: string; replacements?: Record<string, unknown> }[]) {
  await t.sequelize.transaction(async (transaction) => {
    await t.sequelize.query('ALTER TABLE sign_offs DISABLE TRIGGER USER', { transaction });
    for (const s of statements) await t.sequelize.query(s.sql, { replacements: s.replacements, transaction });
    await t.sequelize.query('ALTER TABLE sign_offs ENABLE TRIGGER USER', { transaction });
  });
}

const fieldsOf = (r: SignOffModel, over: Partial<Record<string, unknown>> = {}) => ({
  requestId: r.requestId, seq: r.seq, action: r.action, fromStatus: r.fromStatus, toStatus: r.toStatus, role: r.role,
  userId: r.userId, printedName: r.printedName, decision: r.decision, meaning: r.meaning, comment: r.comment,
  signedAt: r.signedAt.toISOString(), details: r.details, ...over,
});
const plainSha = (prev: string, fields: unknown, contentHash: string) => createHash('sha256').update(prev + canonicalJson(fields) + contentHash).digest('hex');

/** Rewrites the whole chain of a request from `rows`, hashing each with `hash` (a re-chain). */
async function rechain(rows: SignOffModel[], edit: (r: SignOffModel) => Partial<Record<string, unknown>>, hash: (prev: string, f: unknown, c: string) => string) {
  let prev = GENESIS_HASH;
  const statements = [];
  for (const r of rows) {
    const over = edit(r);
    const h = hash(prev, fieldsOf(r, over), r.contentHash);
    statements.push({
      sql: 'UPDATE sign_offs SET user_id = :userId, printed_name = :printedName, prev_hash = :prev, hash = :h WHERE id = :id',
      replacements: { userId: over.userId ?? r.userId, printedName: over.printedName ?? r.printedName, prev, h, id: r.id },
    });
    prev = h;
  }
  await asOwner(statements);
}

describe('the record check against tampering', () => {
  it('when the brand lead approval is re-attributed to the other brand lead with every hash recomputed by SHA-256, then not intact', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    expect((await verify(s.users.lead.auth, id)).intact).toBe(true);
    const rows = await SignOffModel.findAll({ where: { requestId: id }, order: [['seq', 'ASC']] });
    const other = s.users.otherLead.user;
    await rechain(rows, (r) => (r.action === 'approve' ? { userId: other.id, printedName: other.name } : {}), plainSha);
    expect(await verify(s.users.lead.auth, id)).toMatchObject({ intact: false, firstBrokenSeq: 1 });
  });

  it('when someone even holds the chain key and re-attributes the approval, then the check finds a signer who could not sign', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    const rows = await SignOffModel.findAll({ where: { requestId: id }, order: [['seq', 'ASC']] });
    const other = s.users.otherLead.user;
    await rechain(rows, (r) => (r.action === 'approve' ? { userId: other.id, printedName: other.name } : {}), (p, f, c) => chainHash(p, f as never, c));
    const v = await verify(s.users.lead.auth, id);
    expect(v).toMatchObject({ intact: false, firstBrokenSeq: 3 });
    expect(v.reason).toMatch(/could not sign this step/);
  });

  it('when the chain is re-chained with the key (a name changed, every hash recomputed), then the anchor outside the database does not match', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    const rows = await SignOffModel.findAll({ where: { requestId: id }, order: [['seq', 'ASC']] });
    await rechain(rows, (r) => (r.seq === 1 ? { printedName: 'Somebody Else' } : {}), (p, f, c) => chainHash(p, f as never, c));
    expect(await verify(s.users.lead.auth, id)).toMatchObject({ intact: false, reason: expect.stringMatching(/fingerprint recorded outside the database/) });
  });

  it('when the last sign-off is deleted and the state set back, then the anchor shows sign-offs were removed', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    await asOwner([{ sql: 'DELETE FROM sign_offs WHERE request_id = :id AND seq = 3', replacements: { id } }]);
    await ChangeRequestModel.update({ status: 'brand_approval' }, { where: { id } });
    expect(await verify(s.users.lead.auth, id)).toMatchObject({ intact: false, firstBrokenSeq: 3, reason: expect.stringMatching(/missing here: sign-offs were removed/) });
  });

  it('when nothing was touched, then the check says intact and what it covered', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    const v = await verify(s.users.lead.auth, id);
    expect(v).toMatchObject({ intact: true, checked: 3 });
    expect(v.covers!.join(' ')).toMatch(/key the database does not hold.*outside the database.*role and the brand or factory/);
    expect(Date.parse(v.checkedAt!)).not.toBeNaN();
  });
});
