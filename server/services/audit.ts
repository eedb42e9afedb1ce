import type { Transaction } from 'sequelize';
import { AuditEventModel } from '../models';
import { appendAuditEvents } from './audit-chain';
import type { Actor } from '../lib/auth';

export async function recordAudit(
  transaction: Transaction | undefined,
  actor: Pick<Actor, 'id' | 'name'> | null,
  action: string,
  entity: string,
  entityId: string | null,
  before: unknown,
  after: unknown,
) {
  const row = { actorId: actor?.id ?? null, actorName: actor?.name ?? null, action, entity, entityId, before: before ?? null, after: after ?? null };
  // Chained (audit-chain.ts); without a caller's transaction, in one of its own.
  if (transaction) await appendAuditEvents(transaction, [row]);
  else await AuditEventModel.sequelize!.transaction((t) => appendAuditEvents(t, [row]));
}
