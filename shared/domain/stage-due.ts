import type { RequestState } from './lifecycle';

// Due dates per stage of the request lifecycle: each waiting stage may take a number of business
// days (Monday to Friday; weekends do not count) before it is overdue and reminders go out.
// The numbers are a company setting (`stage_due_business_days`); these are the defaults
// (common practice, no published source). Public holidays are not known here and count as
// business days.

export const stagesWithDueDates = ['engineering_review', 'brand_approval', 'cut_authorized', 'samples_review'] as const satisfies readonly RequestState[];
export type StageWithDueDate = (typeof stagesWithDueDates)[number];

export type StageDueDays = Record<StageWithDueDate, number>;

export const defaultStageDueDays: StageDueDays = {
  engineering_review: 3,
  brand_approval: 2,
  cut_authorized: 10,
  samples_review: 5,
};

/** The allowed range for a stage's business days in the setting. */
export const STAGE_DUE_DAYS = { min: 1, max: 60 } as const;

export const hasDueDate = (s: RequestState): s is StageWithDueDate => (stagesWithDueDates as readonly string[]).includes(s);

/** The stored setting, each stage falling back to its default when missing or out of range. */
export function parseStageDueDays(value: unknown): StageDueDays {
  const out = { ...defaultStageDueDays };
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return out;
  for (const s of stagesWithDueDates) {
    const v = (value as Record<string, unknown>)[s];
    if (typeof v === 'number' && Number.isInteger(v) && v >= STAGE_DUE_DAYS.min && v <= STAGE_DUE_DAYS.max) out[s] = v;
  }
  return out;
}

const isWeekendUtc = (d: Date) => d.getUTCDay() === 0 || d.getUTCDay() === 6;

/**
 * `from` plus `days` business days, keeping the time of day (UTC calendar). Every calendar day
 * stepped over that is a Saturday or Sunday does not count, so Friday 10:00 + 1 is Monday 10:00,
 * and a stage entered on a Saturday at 10:00 with 1 day is due on Monday at 10:00.
 */
export function addBusinessDays(from: Date, days: number): Date {
  if (!Number.isInteger(days) || days < 0) throw new RangeError(`Business days must be a whole number, zero or more (got ${days})`);
  const d = new Date(from.getTime());
  let left = days;
  while (left > 0) {
    d.setUTCDate(d.getUTCDate() + 1);
    if (!isWeekendUtc(d)) left -= 1;
  }
  return d;
}

/** When a stage entered at `enteredAt` is due; null for a stage that waits for nobody in particular. */
export function stageDueAt(state: RequestState, enteredAt: Date, days: StageDueDays = defaultStageDueDays): Date | null {
  return hasDueDate(state) ? addBusinessDays(enteredAt, days[state]) : null;
}

export const isOverdue = (dueAt: Date | string | null | undefined, now: Date): boolean =>
  dueAt !== null && dueAt !== undefined && new Date(dueAt).getTime() < now.getTime();
