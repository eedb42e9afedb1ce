// The audit trail is chained and anchored like the sign-offs: rewriting or deleting an event,
// even with the guard switched off by the owner, is found by the check.
import { AuditEventModel } from '../../server/models';
import { auditHash } from '../../server/services/audit-chain';
import { makeBrand, makeFactory, makeUser, openTestApp, request } from './helpers';
import { makeTool } from './registry-helpers';

const t = openTestApp();
afterAll(() => t.close());

async function asOwner(sql: string, replacements: Record<string, unknown>) {
  await t.sequelize.transaction(async (transaction) => {
    // The owner gives itself back what the migration revoked, and switches the guard off.
    await t.sequelize.query('GRANT UPDATE, DELETE ON audit_events TO CURRENT_USER', { transaction });
    await t.sequelize.query('ALTER TABLE audit_events DISABLE TRIGGER USER', { transaction });
    await t.sequelize.query(sql, { replacements, transaction });
    await t.sequelize.query('ALTER TABLE audit_events ENABLE TRIGGER USER', { transaction });
    await t.sequelize.query('REVOKE UPDATE, DELETE ON audit_events FROM CURRENT_USER', { transaction });
  });
}

describe('the audit chain', () => {
  // One test, in order: every tamper is undone before the next, as the chain is shared.
  it('when events are written, then the chain is intact; a rewritten or deleted event breaks it', async () => {
    const brand = await makeBrand();
    const factory = await makeFactory();
    const engineer = await makeUser('engineer', { brandIds: [brand.id] });
    const admin = await makeUser('admin');
    const tool = await makeTool({ brandId: brand.id, factoryId: factory.id });
    const edit = await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 0, storageLocation: 'Bay 7' });
    expect(edit.status).toBe(200);
    const event = (await AuditEventModel.findOne({ where: { entity: 'tool', entityId: tool.id, action: 'tool.update' } }))!;
    expect(event.seq).not.toBeNull();
    expect(event.hash).toMatch(/^[0-9a-f]{64}$/);

    const ok = await request(t.app).get('/api/audit/verify').set(admin.auth);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ intact: true });
    expect((await request(t.app).get('/api/audit/verify').set(engineer.auth)).status).toBe(403);

    // Rewritten with a hash recomputed the only way someone without the key could.
    await asOwner(`UPDATE audit_events SET actor_name = 'Someone Else', hash = :h WHERE id = :id`, { h: auditHash(event.prevHash!, { seq: Number(event.seq), at: event.at.toISOString(), actorId: event.actorId, actorName: 'Someone Else', action: event.action, entity: event.entity, entityId: event.entityId, before: event.before, after: event.after }, 'a-guessed-key-that-is-not-the-real-one-000'), id: event.id });
    const rewritten = await request(t.app).get('/api/audit/verify').set(admin.auth);
    expect(rewritten.body).toMatchObject({ intact: false, firstBrokenSeq: Number(event.seq) });
    await asOwner('UPDATE audit_events SET actor_name = :n, hash = :h WHERE id = :id', { n: event.actorName, h: event.hash, id: event.id });
    expect((await request(t.app).get('/api/audit/verify').set(admin.auth)).body.intact).toBe(true);

    // The newest event deleted: the anchor outside the database still names it.
    await request(t.app).patch(`/api/tools/${tool.id}`).set(engineer.auth).send({ version: 1, storageLocation: 'Bay 8' });
    const last = (await AuditEventModel.findOne({ order: [['seq', 'DESC']] }))!;
    await asOwner('DELETE FROM audit_events WHERE id = :id', { id: last.id });
    const cut = await request(t.app).get('/api/audit/verify').set(admin.auth);
    expect(cut.body).toMatchObject({ intact: false, reason: expect.stringMatching(/missing here|missing or out of order/) });
  });
});
