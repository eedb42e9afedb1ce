import { addDays, addYears, differenceInCalendarDays, format, isValid, parseISO } from 'date-fns';

/**
 * Retention: a tool idle since its last run falls due for a keep-or-scrap decision after the
 * company's retention period (DESIGN.md section 5).
 *
 * - The period is a company setting in whole years: default 3, allowed 2 to 5. This range is the
 *   product brief's rule; TRADE-FACTS 6.4 finds one published 2-year example (a molder's terms)
 *   and calls "2-5 years" a trade norm without an authoritative source.
 * - Due date = last run date + N years, as calendar years (date-fns `addYears`). A last run on
 *   29 February falls due on 28 February when the due year is not a leap year
 *   (2024-02-29 + 1 year = 2025-02-28; + 4 years = 2028-02-29). PostgreSQL's
 *   `date + interval 'N years'` clamps the same way, so the database filter and this function agree.
 * - A tool that never ran counts from its build date; without either date there is no due date.
 * - A "keep until" decision moves the due date to the kept-until date, or later when the tool has
 *   run again since (the later of the two counts). A scrap or sell decision, or a disposed tool,
 *   has no due date: the decision is made.
 *
 * Dates are ISO calendar dates ("YYYY-MM-DD") with no time of day; "today" is the caller's date in
 * their own time zone (todayInZone).
 */

export const RETENTION_YEARS = { min: 2, max: 5, default: 3 } as const;

/** "Due soon" looks this many days ahead unless the caller asks otherwise. */
export const RETENTION_WINDOW_DAYS = 90;

export type RetentionDecisionKind = 'keep_until' | 'scrap' | 'sell';

export type RetentionState = 'decided' | 'no_date' | 'overdue' | 'due_soon' | 'not_due';

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function parseDate(iso: string, field: string): Date {
  const d = ISO_DATE.test(iso) ? parseISO(iso) : new Date(Number.NaN);
  if (!isValid(d) || format(d, 'yyyy-MM-dd') !== iso) throw new RangeError(`${field} is not a calendar date (YYYY-MM-DD): ${iso}`);
  return d;
}

const iso = (d: Date) => format(d, 'yyyy-MM-dd');

export function assertRetentionYears(years: number): void {
  if (!Number.isInteger(years) || years < RETENTION_YEARS.min || years > RETENTION_YEARS.max) {
    throw new RangeError(`Retention must be a whole number of years from ${RETENTION_YEARS.min} to ${RETENTION_YEARS.max}, got ${years}`);
  }
}

/** date + N calendar years; 29 February becomes 28 February in a non-leap year. */
export function addRetentionYears(date: string, years: number): string {
  assertRetentionYears(years);
  return iso(addYears(parseDate(date, 'date'), years));
}

export function addCalendarDays(date: string, days: number): string {
  return iso(addDays(parseDate(date, 'date'), days));
}

/** Whole calendar days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return differenceInCalendarDays(parseDate(to, 'to'), parseDate(from, 'from'));
}

export interface ToolRetentionInput {
  lastRunDate: string | null;
  buildDate: string | null;
  years: number;
  status: string;
  decision: RetentionDecisionKind | null;
  keepUntil: string | null;
}

/** The date the tool's keep-or-scrap decision falls due, or null when none is due. */
export function retentionDueDate(t: ToolRetentionInput): string | null {
  assertRetentionYears(t.years);
  if (t.status === 'disposed' || t.decision === 'scrap' || t.decision === 'sell') return null;
  const basis = t.lastRunDate ?? t.buildDate;
  const fromRun = basis ? addRetentionYears(basis, t.years) : null;
  const kept = t.decision === 'keep_until' ? t.keepUntil : null;
  if (fromRun && kept) return fromRun > kept ? fromRun : kept;
  return fromRun ?? kept;
}

/** Is `dueOn` on or before today + `days`? (Overdue counts as due.) */
export function isDueWithin(dueOn: string | null, today: string, days: number = RETENTION_WINDOW_DAYS): boolean {
  if (!dueOn) return false;
  return dueOn <= addCalendarDays(today, days);
}

export interface RetentionSummary {
  dueOn: string | null;
  state: RetentionState;
  /** Days from today to the due date (negative when overdue), null without a due date. */
  daysLeft: number | null;
}

export function retentionSummary(t: ToolRetentionInput, today: string, withinDays: number = RETENTION_WINDOW_DAYS): RetentionSummary {
  const dueOn = retentionDueDate(t);
  if (!dueOn) {
    const decided = t.status === 'disposed' || t.decision === 'scrap' || t.decision === 'sell';
    return { dueOn: null, state: decided ? 'decided' : 'no_date', daysLeft: null };
  }
  const daysLeft = daysBetween(today, dueOn);
  const state: RetentionState = daysLeft < 0 ? 'overdue' : daysLeft <= withinDays ? 'due_soon' : 'not_due';
  return { dueOn, state, daysLeft };
}

/** Today's calendar date in an IANA time zone ("Asia/Shanghai"), as YYYY-MM-DD. */
export function todayInZone(timeZone: string, now: Date = new Date()): string {
  let zone = timeZone;
  try {
    new Intl.DateTimeFormat('en-CA', { timeZone: zone });
  } catch {
    zone = 'UTC';
  }
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}
