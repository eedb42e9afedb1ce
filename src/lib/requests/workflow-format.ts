// Times and due dates as the workflow screens show them: in the viewer's own time zone, with the
// UTC time kept beside it, and due dates in words ("Overdue by 3 days").

const DAY_MS = 86_400_000;

/** A zone Intl knows, else UTC (a stored zone name from another platform must not break a screen). */
export function usableZone(timeZone: string | null | undefined): string {
  if (!timeZone) return 'UTC';
  try {
    new Intl.DateTimeFormat('en-US', { timeZone }).format(0);
    return timeZone;
  } catch {
    return 'UTC';
  }
}

function partsIn(d: Date, timeZone: string) {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'short',
  }).formatToParts(d);
  const get = (t: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === t)?.value ?? '';
  return { day: get('day'), month: get('month'), year: get('year'), hour: get('hour'), minute: get('minute'), zone: get('timeZoneName') };
}

/** "3 Dec 2026, 09:14 PST" in the viewer's zone. */
export function formatInZone(iso: string, timeZone: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const p = partsIn(d, usableZone(timeZone));
  return `${p.day} ${p.month} ${p.year}, ${p.hour}:${p.minute} ${p.zone}`;
}

/** "2026-12-03 17:14:07 UTC": the time as the record keeps it. */
export function formatUtc(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
}

/** The calendar date (YYYY-MM-DD) of an instant in a zone. */
function dateIn(d: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(d);
}

export interface DueWords {
  text: string;
  overdue: boolean;
}

/**
 * A stage's due date in words, in the viewer's zone: "Overdue by 3 days", "Overdue since 14:00
 * today", "Due today at 17:00", "Due tomorrow", "Due 5 Dec". Null when the stage has no due date.
 */
export function dueWords(stageDueAt: string | null, now: Date, timeZone: string): DueWords | null {
  if (!stageDueAt) return null;
  const due = new Date(stageDueAt);
  if (Number.isNaN(due.getTime())) return null;
  const zone = usableZone(timeZone);
  const p = partsIn(due, zone);
  const at = `${p.hour}:${p.minute}`;
  if (due.getTime() < now.getTime()) {
    const days = Math.floor((now.getTime() - due.getTime()) / DAY_MS);
    if (days >= 1) return { text: `Overdue by ${days} ${days === 1 ? 'day' : 'days'}`, overdue: true };
    return { text: `Overdue since ${at}${dateIn(due, zone) === dateIn(now, zone) ? ' today' : ' yesterday'}`, overdue: true };
  }
  const today = dateIn(now, zone);
  const dueDay = dateIn(due, zone);
  if (dueDay === today) return { text: `Due today at ${at}`, overdue: false };
  if (dueDay === dateIn(new Date(now.getTime() + DAY_MS), zone)) return { text: `Due tomorrow at ${at}`, overdue: false };
  const sameYear = dueDay.slice(0, 4) === today.slice(0, 4);
  return { text: `Due ${p.day} ${p.month}${sameYear ? '' : ` ${p.year}`}`, overdue: false };
}

/** "Wren Okafor and Tomas Ilves" */
export const andList = (xs: readonly string[]) => (xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`);

/** Today's date (YYYY-MM-DD) in the viewer's zone, e.g. the default day of a recorded cut. */
export const todayIn = (timeZone: string, now: Date = new Date()) => dateIn(now, usableZone(timeZone));
