// Recording the cut: the factory's receipt of the cut sheet must come first; then the actual cost
// with its currency, the day of the cut, the mold trial (day and shots), at least one photo of the
// first samples, the tool's shot counter after the trial, and the first-article report (each cut
// item measured on a molded sample, pass or fail against intended ± tolerance).
import type { Transaction } from 'sequelize';
import { judgeFirstArticle, reportPasses } from '../../shared/domain/first-article';
import type { CutReportInput } from '../../shared/schemas/request-actions';
import type { CutReport, FirstArticleResult } from '../../shared/schemas/sign-offs';
import type { Actor } from '../lib/auth';
import { AppError } from '../lib/errors';
import { AttachmentModel, ToolModel, type ChangeItemModel, type ChangeRequestModel } from '../models';
import { recordAudit } from './audit';

const groupDigits = (n: number) => n.toLocaleString('en-US');

/** The latest calendar date anywhere (UTC+14), so a day "today" in any zone is accepted. */
const latestToday = (at: Date) => new Date(at.getTime() + 14 * 3_600_000).toISOString().slice(0, 10);

/** 422 unless a toolmaker of the tool's factory has confirmed receipt of the cut sheet. */
export function assertReceiptConfirmed(r: ChangeRequestModel) {
  if (r.cutSheetReceivedAt) return;
  throw new AppError(
    'receipt_missing',
    'Nothing was signed: the factory has not yet confirmed receipt of the cut sheet. A toolmaker of the factory confirms receipt first, then the cut can be recorded.',
    422,
    { receipt: ['The factory confirms receipt of the cut sheet first'] },
    { i18n: { key: 'errors.receipt_missing' } },
  );
}

/** Field errors of the report against this request (dates, one line per cut item), or null. */
function reportErrors(cut: CutReportInput, items: readonly ChangeItemModel[], at: Date): Record<string, string[]> | null {
  const errors: Record<string, string[]> = {};
  const today = latestToday(at);
  if (cut.cutOn > today) errors['cut.cutOn'] = ['The cut cannot be dated in the future'];
  if (cut.trialOn > today) errors['cut.trialOn'] = ['The mold trial cannot be dated in the future'];
  else if (cut.trialOn < cut.cutOn) errors['cut.trialOn'] = ['The mold trial comes after the cut: check both dates'];
  const ids = new Set(items.map((i) => i.id));
  const seen = new Set<string>();
  cut.firstArticle.forEach((line, n) => {
    if (!ids.has(line.itemId)) errors[`cut.firstArticle.${n}.itemId`] = ['This is not a cut item of this request: reload the request'];
    else if (seen.has(line.itemId)) errors[`cut.firstArticle.${n}.itemId`] = ['This cut item is measured twice: keep one line'];
    seen.add(line.itemId);
  });
  const missing = items.filter((i) => !seen.has(i.id));
  if (missing.length) {
    errors['cut.firstArticle'] = [`Measure every cut item on a molded sample: item ${missing.map((i) => i.position + 1).join(', ')} missing`];
  }
  return Object.keys(errors).length ? errors : null;
}

/** The first-article report with pass or fail per item, in item order. */
export function firstArticleResults(cut: CutReportInput, items: readonly ChangeItemModel[]): FirstArticleResult[] {
  const byId = new Map(cut.firstArticle.map((l) => [l.itemId, l]));
  return items
    .filter((i) => byId.has(i.id))
    .map((i) => {
      const line = byId.get(i.id)!;
      const j = judgeFirstArticle(line);
      return {
        itemId: i.id,
        position: i.position,
        partName: i.part?.name ?? '',
        unit: i.unit,
        intended: line.intended,
        tolerance: line.tolerance,
        measured: line.measured,
        deviation: j.deviation,
        pass: j.pass,
      };
    });
}

/**
 * The tool's shot counter after the trial becomes its shot count; a reading lower than the count
 * on record is refused (a counter only goes up). The tool row is locked for the check.
 */
export async function applyShotReading(transaction: Transaction, actor: Actor, toolId: string, reading: number, at: Date, requestId: string) {
  const tool = (await ToolModel.findByPk(toolId, { transaction, lock: transaction.LOCK.UPDATE }))!;
  const previous = Number(tool.shotCount);
  if (reading < previous) {
    throw new AppError(
      'shot_reading_lower',
      `Nothing was signed: the shot counter reading ${groupDigits(reading)} is lower than the ${groupDigits(previous)} shots on record for tool ${tool.code}. Read the counter again after the trial and enter that number.`,
      422,
      { 'cut.shotReading': [`Lower than the ${groupDigits(previous)} shots on record`] },
      { i18n: { key: 'errors.shot_reading_lower', params: { reading: groupDigits(reading), previous: groupDigits(previous), toolCode: tool.code } } },
    );
  }
  if (reading !== previous) {
    tool.shotCount = reading;
    await tool.save({ transaction });
  }
  await recordAudit(transaction, actor, 'tool.shot_reading', 'tool', tool.id, { shotCount: previous }, {
    shotCount: reading,
    source: 'record_cut',
    changeRequestId: requestId,
    readAt: at.toISOString(),
  });
  return previous;
}

/**
 * Checks the cut report of a record_cut and returns it as stored (on the request and in the
 * sign-off); updates the tool's shot count. Throws 422 for a missing receipt, a missing sample
 * photo or a lower reading, and 400 with field errors for dates and report lines.
 */
export async function recordCut(
  transaction: Transaction,
  actor: Actor,
  r: ChangeRequestModel,
  items: readonly ChangeItemModel[],
  cut: CutReportInput | undefined,
  at: Date,
): Promise<CutReport> {
  assertReceiptConfirmed(r);
  if (!cut) {
    throw new AppError('validation_failed', 'Nothing was signed: enter the cut report (cost, dates, trial, shot counter and measurements).', 400, {
      cut: ['Enter the actual cost and the date of the cut'],
    });
  }
  const photos = await AttachmentModel.findAll({ where: { requestId: r.id, kind: 'sample' }, attributes: ['id'], order: [['createdAt', 'ASC']], transaction });
  if (photos.length === 0) {
    throw new AppError(
      'sample_photo_missing',
      'Nothing was signed: add at least one photo of the first samples, then record the cut.',
      422,
      { 'cut.photos': ['Add at least one photo of the first samples'] },
      { i18n: { key: 'errors.sample_photo_missing' } },
    );
  }
  const errors = reportErrors(cut, items, at);
  if (errors) {
    const first = Object.values(errors)[0]![0]!;
    throw new AppError('validation_failed', `Nothing was signed. ${first}.`, 400, errors);
  }
  const previousShotCount = await applyShotReading(transaction, actor, r.toolId, cut.shotReading, at, r.id);
  const firstArticle = firstArticleResults(cut, items);
  return {
    actualCostCents: cut.actualCostCents,
    currency: cut.currency,
    cutOn: cut.cutOn,
    note: cut.note ?? '',
    trialOn: cut.trialOn,
    trialShots: cut.trialShots,
    shotReading: cut.shotReading,
    previousShotCount,
    photoIds: photos.map((p) => p.id),
    firstArticle,
    firstArticlePass: reportPasses(firstArticle),
    recordedBy: { id: actor.id, name: actor.name },
    recordedAt: at.toISOString(),
  };
}
