// Two database roles. The owner (the role in DATABASE_URL, which owns the database) runs the
// migrations; the server runs as SERVER_ROLE, which owns nothing: it reads and writes the business
// tables, and may only read and insert into the record (sign_offs, audit_events,
// membership_history), so it can neither rewrite a row nor switch the append-only triggers off
// (ALTER TABLE, TRUNCATE and TRIGGER need ownership or grants it does not have). The role itself is
// made by `scripts/db.sh` (it needs the database superuser); these grants are per database, run by
// the owner after every migration.
import type { Sequelize } from 'sequelize';

export const SERVER_ROLE = 'toolgate_server';
const SERVER_PASSWORD = 'toolgate_server';

/** Append-only: the server may read and insert, nothing more. */
export const RECORD_TABLES = ['sign_offs', 'audit_events', 'membership_history'] as const;

/** The same database, reached as the server role. */
export function serverRoleUrl(ownerUrl: string) {
  const u = new URL(ownerUrl);
  u.username = SERVER_ROLE;
  u.password = SERVER_PASSWORD;
  return u.toString();
}

export async function grantServerRole(owner: Sequelize) {
  const q = (sql: string) => owner.query(sql);
  const [[{ db }]] = (await owner.query('SELECT current_database() AS db')) as [[{ db: string }], unknown];
  const role = `"${SERVER_ROLE}"`;
  await q(`GRANT CONNECT, TEMPORARY ON DATABASE "${db.replace(/"/g, '""')}" TO ${role}`);
  await q(`GRANT USAGE ON SCHEMA public TO ${role}`);
  await q(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${role}`);
  await q(`GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA public TO ${role}`);
  await q(`REVOKE UPDATE, DELETE, TRUNCATE, TRIGGER, REFERENCES ON ${RECORD_TABLES.join(', ')} FROM ${role}`);
  await q(`REVOKE UPDATE, DELETE, TRUNCATE, TRIGGER, REFERENCES ON ${RECORD_TABLES.join(', ')} FROM PUBLIC`);
  // The job queue (pg-boss) is installed by the owner; the server reads and writes its rows, and
  // jobs are queued inside the server's own transactions.
  await q('CREATE SCHEMA IF NOT EXISTS pgboss');
  await q(`GRANT USAGE ON SCHEMA pgboss TO ${role}`);
  await q(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA pgboss TO ${role}`);
  await q(`GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA pgboss TO ${role}`);
  await q(`ALTER DEFAULT PRIVILEGES IN SCHEMA pgboss GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${role}`);
  await q(`ALTER DEFAULT PRIVILEGES IN SCHEMA pgboss GRANT USAGE, SELECT, UPDATE ON SEQUENCES TO ${role}`);
}
