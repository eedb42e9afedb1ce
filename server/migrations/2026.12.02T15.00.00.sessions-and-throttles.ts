import type { Migration } from '../db/migrator';

// Sessions live in PostgreSQL so that signing out, changing a password, changing a role and
// deactivating end them on every server at once. Failure counters (sign-in, signing password)
// live here too, so every server counts the same attempts.

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE sessions (
      id uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      ended_at timestamptz,
      ended_reason varchar(40)
    );
    CREATE INDEX sessions_user_open ON sessions (user_id) WHERE ended_at IS NULL;

    -- A change of password, role or a deactivation ends every open session of that user,
    -- whichever code path made the change.
    CREATE FUNCTION end_sessions_on_user_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF NEW.password_hash IS DISTINCT FROM OLD.password_hash
         OR NEW.role IS DISTINCT FROM OLD.role
         OR (OLD.active AND NOT NEW.active) THEN
        UPDATE sessions SET ended_at = now(),
          ended_reason = CASE WHEN NEW.password_hash IS DISTINCT FROM OLD.password_hash THEN 'password_changed'
                              WHEN NEW.role IS DISTINCT FROM OLD.role THEN 'role_changed'
                              ELSE 'deactivated' END
        WHERE user_id = NEW.id AND ended_at IS NULL;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER users_end_sessions AFTER UPDATE OF password_hash, role, active ON users
      FOR EACH ROW EXECUTE FUNCTION end_sessions_on_user_change();

    CREATE TABLE auth_throttles (
      key varchar(400) PRIMARY KEY,
      failures integer NOT NULL DEFAULT 0,
      window_started_at timestamptz NOT NULL DEFAULT now(),
      last_failure_at timestamptz NOT NULL DEFAULT now(),
      locked_at timestamptz
    );
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE auth_throttles;
    DROP TRIGGER users_end_sessions ON users;
    DROP FUNCTION end_sessions_on_user_change();
    DROP TABLE sessions;
  `);
};
