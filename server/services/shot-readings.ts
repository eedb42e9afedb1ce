// Shot-counter readings: a reading never runs backwards, every reading is kept, and the tool's
// counter (which the life gauge reads) follows the latest one.
import type { Transaction } from 'sequelize';
import type { ShotReadingSource } from '../../shared/schemas/tool-life-events';
import { AppError, notFound } from '../lib/errors';
import { ToolModel, UserModel } from '../models';
import { ToolShotReadingModel } from '../models/tool-shot-reading';
import { recordAudit } from './audit';
import { assertEditable } from './registry-common';

export interface ShotReadingInput {
  toolId: string;
  reading: number;
  readAt: Date | string;
  source: ShotReadingSource;
  userId: string | null;
  /** The change request (or move) the reading was taken for, if any. */
  requestId?: string | null;
  note?: string | null;
}

export interface RecordedShotReading {
  id: string;
  toolId: string;
  reading: number;
  previous: number;
  readAt: string;
  source: ShotReadingSource;
  recordedBy: string | null;
  requestId: string | null;
  note: string | null;
  createdAt: string;
}

const readingError = (message: string) => new AppError('validation_failed', message, 422, { reading: [message] });

/** The tool's last known count: its counter, which every stored reading has moved forward. */
async function lastReadingOf(tool: ToolModel, transaction: Transaction) {
  const last = await ToolShotReadingModel.findOne({ where: { toolId: tool.id }, order: [['createdAt', 'DESC']], transaction });
  return Math.max(tool.shotCount, last?.reading ?? 0);
}

/**
 * Stores a reading inside the caller's transaction: locks the tool, refuses a reading below the last
 * one (422 on `reading`), moves the tool's counter and last run date forward and audits it.
 * The caller checks who may report for this tool.
 */
export async function recordShotReading(input: ShotReadingInput, transaction: Transaction): Promise<RecordedShotReading> {
  const { toolId, reading, source, userId } = input;
  if (!Number.isSafeInteger(reading) || reading < 0) throw readingError('Use a whole number of shots, zero or more');
  const readAt = new Date(input.readAt);
  if (Number.isNaN(readAt.getTime())) throw new AppError('validation_failed', 'Give the date the counter was read', 422, { readAt: ['Use a calendar date'] });

  const tool = await ToolModel.findByPk(toolId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!tool) throw notFound('Tool');
  assertEditable(tool);
  const previous = await lastReadingOf(tool, transaction);
  if (reading < previous) {
    throw readingError(
      `The counter of ${tool.code} last read ${previous.toLocaleString('en-US')} shots; a counter does not run backwards. ` +
        'Check the reading, or ask the engineer if the counter was replaced.',
    );
  }

  const row = await ToolShotReadingModel.create(
    { toolId, reading, priorReading: previous, readAt, source, recordedBy: userId, requestId: input.requestId ?? null, note: input.note?.trim() || null },
    { transaction },
  );
  const before = { shotCount: tool.shotCount, lastRunDate: tool.lastRunDate };
  const readOn = readAt.toISOString().slice(0, 10);
  const ran = reading > previous;
  const changes: Partial<Pick<ToolModel, 'shotCount' | 'lastRunDate'>> = {};
  if (reading !== tool.shotCount) changes.shotCount = reading;
  if (ran && (!tool.lastRunDate || tool.lastRunDate < readOn)) changes.lastRunDate = readOn;
  if (Object.keys(changes).length) await tool.update(changes, { transaction });

  const actor = userId ? await UserModel.findByPk(userId, { attributes: ['id', 'name'], transaction }) : null;
  await recordAudit(transaction, actor ? { id: actor.id, name: actor.name } : null, 'tool.shot_reading', 'tool', toolId, before, {
    shotCount: reading,
    lastRunDate: changes.lastRunDate ?? tool.lastRunDate,
    readingId: row.id,
    source,
    requestId: row.requestId,
  });
  return toShotReadingDto(row);
}

export const toShotReadingDto = (r: ToolShotReadingModel): RecordedShotReading => ({
  id: r.id,
  toolId: r.toolId,
  reading: r.reading,
  previous: r.priorReading,
  readAt: r.readAt.toISOString(),
  source: r.source,
  recordedBy: r.recordedBy,
  requestId: r.requestId,
  note: r.note,
  createdAt: r.createdAt.toISOString(),
});
