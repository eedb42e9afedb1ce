// Changes that hold a tool: from "Cleared to cut" until the change ends (closed, or cancelled),
// the tool is being changed. While any such change is open the tool's state cannot leave "being
// changed" and the tool cannot be scrapped or sold, so no change is left without a next step.
import { Op, type Transaction } from 'sequelize';
import type { RequestState } from '../../shared/domain/lifecycle';
import { requestRef } from '../../shared/schemas/change-requests';
import { ChangeRequestModel } from '../models';

/** The states before the clearance and the end states: a change in any other state holds its tool. */
const NOT_HOLDING: readonly string[] = ['draft', 'engineering_review', 'brand_approval', 'closed', 'declined', 'withdrawn', 'cancelled'] satisfies (RequestState | 'cancelled')[];

/** The open changes that hold each of these tools (request numbers), by tool id. */
export async function changesHolding(toolIds: readonly string[], transaction?: Transaction, exceptRequestId?: string): Promise<Map<string, number[]>> {
  const out = new Map<string, number[]>();
  if (!toolIds.length) return out;
  const rows = await ChangeRequestModel.findAll({
    where: { toolId: [...toolIds], status: { [Op.notIn]: [...NOT_HOLDING] }, ...(exceptRequestId ? { id: { [Op.ne]: exceptRequestId } } : {}) },
    attributes: ['toolId', 'number'],
    order: [['number', 'ASC']],
    transaction,
  });
  for (const r of rows) out.set(r.toolId, [...(out.get(r.toolId) ?? []), r.number]);
  return out;
}

export async function changesHoldingTool(toolId: string, transaction?: Transaction, exceptRequestId?: string) {
  return (await changesHolding([toolId], transaction, exceptRequestId)).get(toolId) ?? [];
}

/** "change CR-0002" or "changes CR-0001 and CR-0003". */
export const holdingWords = (numbers: readonly number[]) =>
  numbers.length === 1
    ? `change ${requestRef(numbers[0]!)}`
    : `changes ${numbers.slice(0, -1).map(requestRef).join(', ')} and ${requestRef(numbers[numbers.length - 1]!)}`;
