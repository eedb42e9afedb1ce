// The audit trail, chained like the sign-offs: each event's hash is HMAC-SHA256 (RECORD_CHAIN_KEY)
// over the previous event's hash and the canonical JSON of its own fields, in one sequence for the
// whole trail. Writers take a transaction-wide advisory lock, so events are chained in commit
// order; every new head is anchored outside the database after commit. verifyAuditChain walks it.
import { createHmac } from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { env } from '../env';
import { canonicalJson } from '../lib/canonical-json';
import { appendAnchor, readAnchors } from '../lib/record-anchor';
import { AuditEventModel } from '../models';
import { GENESIS_HASH, anchorStore } from './sign-off-chain';

/** Advisory lock key of the audit chain ("audit" in ASCII). */
const AUDIT_CHAIN_LOCK = 0x6175646974;
const ANCHOR_ID = 'audit-trail';

export interface AuditRow {
  actorId: string | null;
  actorName: string | null;
  action: string;
  entity: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
}

/** A value as PostgreSQL's jsonb gives it back (dates become strings, undefined members vanish). */
const asStored = (v: unknown) => (v === undefined || v === null ? null : (JSON.parse(JSON.stringify(v)) as unknown));

const fieldsOf = (seq: number, at: Date, r: AuditRow) => ({
  seq,
  at: at.toISOString(),
  actorId: r.actorId,
  actorName: r.actorName,
  action: r.action,
  entity: r.entity,
  entityId: r.entityId,
  before: asStored(r.before),
  after: asStored(r.after),
});

export const auditHash = (prev: string, fields: ReturnType<typeof fieldsOf>, key = env.RECORD_CHAIN_KEY) =>
  createHmac('sha256', key).update(prev + canonicalJson(fields), 'utf8').digest('hex');

/** Writes audit events at the end of the chain, inside the caller's transaction. */
export async function appendAuditEvents(transaction: Transaction, rows: readonly AuditRow[]) {
  if (!rows.length) return;
  const sequelize = AuditEventModel.sequelize!;
  await sequelize.query('SELECT pg_advisory_xact_lock(:k)', { replacements: { k: AUDIT_CHAIN_LOCK }, transaction });
  const [last] = await sequelize.query<{ seq: string; hash: string }>('SELECT seq, hash FROM audit_events WHERE seq IS NOT NULL ORDER BY seq DESC LIMIT 1', {
    type: QueryTypes.SELECT,
    transaction,
  });
  let seq = last ? Number(last.seq) : 0;
  let prev = last?.hash ?? GENESIS_HASH;
  const at = new Date(Math.floor(Date.now()));
  const values = rows.map((r) => {
    seq += 1;
    const hash = auditHash(prev, fieldsOf(seq, at, r));
    const v = { ...r, before: r.before ?? null, after: r.after ?? null, at, seq, prevHash: prev, hash };
    prev = hash;
    return v;
  });
  for (let i = 0; i < values.length; i += 500) await AuditEventModel.bulkCreate(values.slice(i, i + 500), { transaction });
  const head = { seq, hash: prev };
  transaction.afterCommit(() => {
    try {
      appendAnchor(anchorStore(), { chain: 'audit_events', id: ANCHOR_ID, seq: head.seq, hash: head.hash, at: at.toISOString() });
    } catch (err) {
      console.error('The audit chain head could not be written to the record anchor file', err);
    }
  });
}

export interface AuditVerifyResult {
  intact: boolean;
  checked: number;
  firstBrokenSeq?: number;
  reason?: string;
  checkedAt: string;
}

/** Recomputes the whole audit chain and checks it against the anchors kept outside the database. */
export async function verifyAuditChain(): Promise<AuditVerifyResult> {
  // The anchors first (see verifyChain): heads anchored before the rows are read must be among them.
  const { anchors, forged } = readAnchors(anchorStore(), 'audit_events', ANCHOR_ID);
  const chained = await AuditEventModel.findAll({ where: { seq: { [Op.ne]: null } }, order: [['seq', 'ASC']] });
  const checkedAt = new Date().toISOString();
  const broken = (checked: number, seq: number, reason: string): AuditVerifyResult => ({ intact: false, checked, firstBrokenSeq: seq, reason, checkedAt });
  let prev = GENESIS_HASH;
  for (const [i, r] of chained.entries()) {
    const seq = Number(r.seq);
    if (seq !== i + 1) return broken(i, seq, `Audit event ${i + 1} is missing or out of order.`);
    if (r.prevHash !== prev) return broken(i, seq, `Audit event ${seq} does not link to the one before it.`);
    if (auditHash(prev, fieldsOf(seq, r.at, r)) !== r.hash) return broken(i, seq, `Audit event ${seq} was changed after it was written.`);
    prev = r.hash!;
  }
  if (forged) return broken(chained.length, chained.length, 'A line of the record kept outside the database was altered.');
  const bySeq = new Map(chained.map((r) => [Number(r.seq), r.hash]));
  for (const a of anchors) {
    if (!bySeq.has(a.seq)) return broken(chained.length, a.seq, `Audit event ${a.seq} is recorded outside the database but is missing here: events were removed.`);
    if (bySeq.get(a.seq) !== a.hash) return broken(chained.length, a.seq, `Audit event ${a.seq} differs from the fingerprint recorded outside the database.`);
  }
  return { intact: true, checked: chained.length, checkedAt };
}
