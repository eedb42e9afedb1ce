// Words and figures for the tool registry screens. Dates arrive as ISO calendar dates
// ("2029-10-21") or instants; they are shown as "21 Oct 2029" (no day/month order to misread).
import { format, isValid, parseISO } from 'date-fns';
import { formatCount } from '@shared/domain/decimal';

/** "2029-10-21" or an ISO instant -> "21 Oct 2029"; empty for null. */
export function formatDay(value: string | null | undefined): string {
  if (!value) return '';
  const d = parseISO(value);
  return isValid(d) ? format(d, 'd MMM yyyy') : value;
}

/** An instant -> "2 Oct 2023, 09:30" in this device's zone. */
export function formatMoment(value: string | null | undefined): string {
  if (!value) return '';
  const d = parseISO(value);
  return isValid(d) ? format(d, 'd MMM yyyy, HH:mm') : value;
}

/** 212400 -> "212,400". */
export const formatShots = (n: number): string => formatCount(n);

/** "in 12 days", "today", "3 days ago". */
export function daysPhrase(daysLeft: number): string {
  if (daysLeft === 0) return 'today';
  const n = Math.abs(daysLeft);
  const unit = n === 1 ? 'day' : 'days';
  return daysLeft > 0 ? `in ${formatCount(n)} ${unit}` : `${formatCount(n)} ${unit} ago`;
}

/** "1 tool", "3 tools". */
export const plural = (n: number, one: string, many = `${one}s`): string => `${formatCount(n)} ${n === 1 ? one : many}`;

/** Weight in kg with grouping: 1480 -> "1,480 kg", 38.5 -> "38.5 kg". */
export function formatKg(kg: number | null): string {
  if (kg === null) return '';
  const [whole, frac] = String(kg).split('.');
  return `${formatCount(Number(whole))}${frac ? `.${frac}` : ''} kg`;
}
