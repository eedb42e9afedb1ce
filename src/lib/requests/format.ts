// Dates and figures as the request screens show them.
import { sizeUnitLabels, type SizeUnit } from '@shared/schemas/change-items';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "3 Dec 2026" from an ISO date or timestamp (calendar dates are read as written, not shifted by zone). */
export function formatDay(iso: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  if (m) return `${Number(m[3])} ${MONTHS[Number(m[2]) - 1]} ${m[1]}`;
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.getDate()} ${MONTHS[d.getMonth()]} ${d.getFullYear()}`;
}

/** "14:05" local time, for "saved at". */
export function formatClock(ms: number): string {
  const d = new Date(ms);
  return `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
}

/** "0.8 mm". */
export const formatSize = (size: string, unit: SizeUnit) => `${size} ${unit}`;
export const unitWord = (unit: SizeUnit) => sizeUnitLabels[unit];

export const formatUnits = (n: number) => n.toLocaleString('en-US');

/** "1.2 MB", "840 KB". */
export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / 1024 / 1024).toFixed(1)} MB`;
  if (n >= 1024) return `${Math.round(n / 1024)} KB`;
  return `${n} bytes`;
}
