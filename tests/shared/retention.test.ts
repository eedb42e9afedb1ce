import { addYears, format, parseISO } from 'date-fns';
import {
  addRetentionYears,
  daysBetween,
  isDueWithin,
  RETENTION_WINDOW_DAYS,
  RETENTION_YEARS,
  retentionDueDate,
  retentionSummary,
  todayInZone,
} from '../../shared/domain/retention';

/** Independent oracle: calendar years in UTC, the day clamped to the month's last day. */
function oracleAddYears(iso: string, years: number) {
  const [y, m, d] = iso.split('-').map(Number) as [number, number, number];
  const lastDay = new Date(Date.UTC(y + years, m, 0)).getUTCDate();
  return new Date(Date.UTC(y + years, m - 1, Math.min(d, lastDay))).toISOString().slice(0, 10);
}

const base = { buildDate: null, status: 'idle', decision: null, keepUntil: null } as const;

describe('retention period', () => {
  it('when nothing is set, then 3 years, allowed 2 to 5', () => {
    // Product rule from the registry brief. TRADE-FACTS 6.4: a molder's terms keep tools 2 years
    // (ermet-buck.de T&C); "2-5 years" is a trade norm: common practice, no published source.
    expect(RETENTION_YEARS).toEqual({ min: 2, max: 5, default: 3 });
    expect(RETENTION_WINDOW_DAYS).toBe(90);
  });

  it.each([1, 6, 2.5, 0])('when the period is %p years, then it is refused', (years) => {
    expect(() => addRetentionYears('2024-01-01', years)).toThrow(RangeError);
  });
});

describe('addRetentionYears (date-fns addYears)', () => {
  it('when the last run is 29 February 2024 and the period 2 years, then 28 February 2026', () => {
    // TRADE-FACTS 9: date-fns 4.4.0 addYears(2024-02-29, 2) -> 2026-02-28 [V-LOCAL].
    expect(addRetentionYears('2024-02-29', 2)).toBe('2026-02-28');
    expect(format(addYears(parseISO('2024-02-29'), 2), 'yyyy-MM-dd')).toBe('2026-02-28');
  });

  it('when the last run is 29 February 2024 and the period 4 years, then 29 February 2028 (a leap year)', () => {
    expect(addRetentionYears('2024-02-29', 4)).toBe('2028-02-29');
  });

  it('when checked over every day of 2023 to 2025 and every allowed period, then it matches date-fns and a UTC oracle', () => {
    for (let t = Date.UTC(2023, 0, 1); t <= Date.UTC(2025, 11, 31); t += 86_400_000) {
      const iso = new Date(t).toISOString().slice(0, 10);
      for (let years = RETENTION_YEARS.min; years <= RETENTION_YEARS.max; years++) {
        const ours = addRetentionYears(iso, years);
        expect(ours).toBe(format(addYears(parseISO(iso), years), 'yyyy-MM-dd'));
        expect(ours).toBe(oracleAddYears(iso, years));
      }
    }
  });

  it('when the process runs in time zones with midnight DST changes, then the dates do not shift', () => {
    const saved = process.env.TZ;
    try {
      for (const tz of ['America/Sao_Paulo', 'Pacific/Apia', 'Asia/Shanghai', 'America/Los_Angeles', 'UTC']) {
        process.env.TZ = tz;
        expect(addRetentionYears('2024-02-29', 3)).toBe('2027-02-28');
        expect(addRetentionYears('2018-11-04', 2)).toBe('2020-11-04');
        expect(daysBetween('2026-03-01', '2026-03-31')).toBe(30);
      }
    } finally {
      process.env.TZ = saved;
    }
  });

  it('when the date is not a calendar date, then RangeError', () => {
    expect(() => addRetentionYears('2023-02-29', 3)).toThrow(RangeError);
    expect(() => addRetentionYears('2023-2-1', 3)).toThrow(RangeError);
  });
});

describe('retentionDueDate', () => {
  it('when a tool last ran on 2023-06-15 with a 3-year period, then due 2026-06-15', () => {
    expect(retentionDueDate({ ...base, lastRunDate: '2023-06-15', years: 3 })).toBe('2026-06-15');
  });

  it('when a tool never ran, then it counts from its build date; with neither date there is no due date', () => {
    expect(retentionDueDate({ ...base, lastRunDate: null, buildDate: '2022-01-10', years: 2 })).toBe('2024-01-10');
    expect(retentionDueDate({ ...base, lastRunDate: null, years: 3 })).toBeNull();
  });

  it('when kept until a date, then the later of that date and last run + period', () => {
    expect(retentionDueDate({ ...base, lastRunDate: '2020-01-01', years: 3, decision: 'keep_until', keepUntil: '2027-05-01' })).toBe('2027-05-01');
    // Ran again after the keep decision: the run pushes the due date past the kept-until date.
    expect(retentionDueDate({ ...base, lastRunDate: '2026-01-01', years: 3, decision: 'keep_until', keepUntil: '2027-05-01' })).toBe('2029-01-01');
  });

  it('when scrapped, sold or disposed, then nothing is due', () => {
    expect(retentionDueDate({ ...base, lastRunDate: '2020-01-01', years: 3, decision: 'scrap', status: 'disposed' })).toBeNull();
    expect(retentionDueDate({ ...base, lastRunDate: '2020-01-01', years: 3, decision: 'sell' })).toBeNull();
    expect(retentionDueDate({ ...base, lastRunDate: '2020-01-01', years: 3, status: 'disposed' })).toBeNull();
  });
});

describe('due within N days', () => {
  it('when due in exactly 90 days, then it is due soon; in 91 days it is not', () => {
    expect(isDueWithin('2027-03-01', '2026-12-01', 90)).toBe(true); // 2026-12-01 + 90 days = 2027-03-01
    expect(isDueWithin('2027-03-02', '2026-12-01', 90)).toBe(false);
    expect(daysBetween('2026-12-01', '2027-03-01')).toBe(90);
  });

  it('when overdue, then it counts as due, with negative days left', () => {
    expect(isDueWithin('2026-01-01', '2026-12-01')).toBe(true);
    const s = retentionSummary({ ...base, lastRunDate: '2023-01-01', years: 3 }, '2026-12-01');
    expect(s).toEqual({ dueOn: '2026-01-01', state: 'overdue', daysLeft: -334 });
  });

  it('when summarised, then each state has its word', () => {
    expect(retentionSummary({ ...base, lastRunDate: '2024-02-29', years: 3 }, '2026-12-01').state).toBe('due_soon'); // due 2027-02-28, 89 days
    expect(retentionSummary({ ...base, lastRunDate: '2025-06-01', years: 3 }, '2026-12-01').state).toBe('not_due');
    expect(retentionSummary({ ...base, lastRunDate: null, years: 3 }, '2026-12-01').state).toBe('no_date');
    expect(retentionSummary({ ...base, lastRunDate: '2020-01-01', years: 3, decision: 'scrap', status: 'disposed' }, '2026-12-01').state).toBe('decided');
  });
});

describe('todayInZone', () => {
  it('when it is 20:00 UTC on 1 December 2026, then it is already 2 December in Shanghai and still 1 December in Los Angeles', () => {
    const now = new Date('2026-12-01T20:00:00Z');
    expect(todayInZone('Asia/Shanghai', now)).toBe('2026-12-02');
    expect(todayInZone('America/Los_Angeles', now)).toBe('2026-12-01');
    expect(todayInZone('Not/AZone', now)).toBe('2026-12-01');
  });
});
