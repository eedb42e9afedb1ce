import type { Transaction } from 'sequelize';
import { AuditEventModel } from '../models';
import { appendAuditEvents } from './audit-chain';
import type { Actor } from '../lib/auth';

export interface AuditEntry {
  action: string;
  entity: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
}

export async function recordAudit(
  transaction: Transaction | undefined,
  actor: Pick<Actor, 'id' | 'name'> | null,
  action: string,
  entity: string,
  entityId: string | null,
  before: unknown,
  after: unknown,
) {
  await recordAudits(transaction, actor, [{ action, entity, entityId, before, after }]);
}

/** Several audit events of one actor, chained in order in one write (a CSV import writes thousands). */
export async function recordAudits(transaction: Transaction | undefined, actor: Pick<Actor, 'id' | 'name'> | null, entries: AuditEntry[]) {
  const rows = entries.map((e) => ({
    actorId: actor?.id ?? null,
    actorName: actor?.name ?? null,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    before: e.before ?? null,
    after: e.after ?? null,
  }));
  // Chained (audit-chain.ts); without a caller's transaction, in one of its own.
  if (transaction) await appendAuditEvents(transaction, rows);
  else await AuditEventModel.sequelize!.transaction((t) => appendAuditEvents(t, rows));
}
