// Failure counters shared by every server process (table auth_throttles). Only failures count:
// a right password clears its account's counter and never uses up a limit.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export interface ThrottleRow {
  failures: number;
  windowStartedAt: Date;
  lastFailureAt: Date;
  lockedAt: Date | null;
}

export async function readThrottle(sequelize: Sequelize, key: string, windowMs: number, transaction?: Transaction): Promise<ThrottleRow | null> {
  const rows = await sequelize.query<ThrottleRow>(
    `SELECT failures, window_started_at AS "windowStartedAt", last_failure_at AS "lastFailureAt", locked_at AS "lockedAt"
     FROM auth_throttles WHERE key = $1 AND (locked_at IS NOT NULL OR window_started_at > now() - make_interval(secs => $2))`,
    { bind: [key, windowMs / 1000], type: QueryTypes.SELECT, transaction },
  );
  return rows[0] ?? null;
}

/** Counts one failure in the window (a new window starts when the old one is over); returns the count. */
export async function recordFailure(sequelize: Sequelize, key: string, windowMs: number, transaction?: Transaction): Promise<number> {
  const rows = await sequelize.query<{ failures: number }>(
    `INSERT INTO auth_throttles AS t (key, failures) VALUES ($1, 1)
     ON CONFLICT (key) DO UPDATE SET
       failures = CASE WHEN t.locked_at IS NULL AND t.window_started_at <= now() - make_interval(secs => $2) THEN 1 ELSE t.failures + 1 END,
       window_started_at = CASE WHEN t.locked_at IS NULL AND t.window_started_at <= now() - make_interval(secs => $2) THEN now() ELSE t.window_started_at END,
       last_failure_at = now()
     RETURNING failures`,
    { bind: [key, windowMs / 1000], type: QueryTypes.SELECT, transaction },
  );
  return rows[0]!.failures;
}

export async function lockThrottle(sequelize: Sequelize, key: string) {
  await sequelize.query(`UPDATE auth_throttles SET locked_at = now() WHERE key = $1 AND locked_at IS NULL`, { bind: [key] });
}

export async function clearThrottle(sequelize: Sequelize, key: string, transaction?: Transaction) {
  await sequelize.query(`DELETE FROM auth_throttles WHERE key = $1`, { bind: [key], transaction });
}
