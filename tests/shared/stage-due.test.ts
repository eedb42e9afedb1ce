import { addBusinessDays as dateFnsAddBusinessDays } from 'date-fns';
import { addBusinessDays, defaultStageDueDays, isOverdue, parseStageDueDays, stageDueAt } from '../../shared/domain/stage-due';

const at = (iso: string) => new Date(iso);

describe('business days', () => {
  // Calendar facts: 2026-12-04 is a Friday, 2026-12-05 a Saturday, 2026-12-07 a Monday
  // (checked against the Gregorian calendar; the day-of-week is also asserted below).
  it('when the calendar is read, then the reference days fall where the cases assume', () => {
    expect(at('2026-12-04T10:00:00Z').getUTCDay()).toBe(5);
    expect(at('2026-12-05T10:00:00Z').getUTCDay()).toBe(6);
    expect(at('2026-12-07T10:00:00Z').getUTCDay()).toBe(1);
  });

  it('when business days are added from a weekday, then they match date-fns addBusinessDays (a reference library)', () => {
    // Noon UTC keeps the local calendar day the same as the UTC one for any zone within 11 hours,
    // so date-fns (local time) and this function (UTC) count the same days.
    for (let d = 0; d < 5; d++) {
      const from = new Date(Date.UTC(2026, 11, 7 + d, 12, 0, 0));
      for (let n = 0; n <= 15; n++) {
        expect([d, n, addBusinessDays(from, n).toISOString().slice(0, 10)]).toEqual([d, n, dateFnsAddBusinessDays(from, n).toISOString().slice(0, 10)]);
      }
    }
  });

  it('when a stage starts on Friday or at the weekend, then Saturday and Sunday do not count (common practice, no published source)', () => {
    expect(addBusinessDays(at('2026-12-04T10:00:00Z'), 1).toISOString()).toBe('2026-12-07T10:00:00.000Z');
    expect(addBusinessDays(at('2026-12-05T10:00:00Z'), 1).toISOString()).toBe('2026-12-07T10:00:00.000Z');
    expect(addBusinessDays(at('2026-12-06T23:30:00Z'), 2).toISOString()).toBe('2026-12-08T23:30:00.000Z');
    expect(addBusinessDays(at('2026-12-04T10:00:00Z'), 10).toISOString()).toBe('2026-12-18T10:00:00.000Z');
    expect(addBusinessDays(at('2026-12-04T10:00:00Z'), 0).toISOString()).toBe('2026-12-04T10:00:00.000Z');
    expect(() => addBusinessDays(at('2026-12-04T10:00:00Z'), -1)).toThrow(RangeError);
  });

  it('when a stage is entered, then it is due after its business days; a draft or a finished request has no due date', () => {
    const thu = at('2026-12-03T09:00:00Z');
    expect(stageDueAt('engineering_review', thu)!.toISOString()).toBe('2026-12-08T09:00:00.000Z');
    expect(stageDueAt('brand_approval', thu)!.toISOString()).toBe('2026-12-07T09:00:00.000Z');
    expect(stageDueAt('cut_authorized', thu)!.toISOString()).toBe('2026-12-17T09:00:00.000Z');
    expect(stageDueAt('samples_review', thu)!.toISOString()).toBe('2026-12-10T09:00:00.000Z');
    expect(stageDueAt('draft', thu)).toBeNull();
    expect(stageDueAt('closed', thu)).toBeNull();
    expect(stageDueAt('brand_approval', thu, { ...defaultStageDueDays, brand_approval: 1 })!.toISOString()).toBe('2026-12-04T09:00:00.000Z');
  });

  it('when the setting is partial or out of range, then those stages keep their defaults', () => {
    expect(parseStageDueDays({ brand_approval: 4, cut_authorized: 0, samples_review: 2.5, engineering_review: '3' })).toEqual({ ...defaultStageDueDays, brand_approval: 4 });
    expect(parseStageDueDays(null)).toEqual(defaultStageDueDays);
    expect(parseStageDueDays([5])).toEqual(defaultStageDueDays);
  });

  it('when the due time has passed, then overdue; exactly at it or with no due date, then not', () => {
    const now = at('2026-12-07T09:00:00Z');
    expect(isOverdue('2026-12-07T08:59:59Z', now)).toBe(true);
    expect(isOverdue(at('2026-12-07T09:00:00Z'), now)).toBe(false);
    expect(isOverdue(null, now)).toBe(false);
  });
});
