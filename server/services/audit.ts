import type { Transaction } from 'sequelize';
import { AuditEventModel } from '../models';
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
  await AuditEventModel.create(
    { actorId: actor?.id ?? null, actorName: actor?.name ?? null, action, entity, entityId, before: before ?? null, after: after ?? null },
    { transaction },
  );
}
