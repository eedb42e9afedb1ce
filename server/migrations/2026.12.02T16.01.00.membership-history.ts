import type { Migration } from '../db/migrator';

// Who held which role, brands and factory, and from when. Written by triggers on users and
// user_brands (so no code path can forget it, and the app's role, which owns neither the tables nor
// the triggers, cannot switch them off); append-only like sign_offs. The record check reads it to
// confirm that each signer could sign what they signed at the moment they signed.

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE membership_history (
      id bigserial PRIMARY KEY,
      user_id uuid NOT NULL,
      role varchar(16) NOT NULL,
      factory_id uuid,
      brand_ids uuid[] NOT NULL DEFAULT '{}',
      active boolean NOT NULL,
      valid_from timestamptz NOT NULL DEFAULT clock_timestamp()
    );
    CREATE INDEX membership_history_user ON membership_history (user_id, valid_from);

    CREATE FUNCTION membership_snapshot(uid uuid) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO membership_history (user_id, role, factory_id, brand_ids, active)
      SELECT u.id, u.role::text, u.factory_id,
             COALESCE((SELECT array_agg(ub.brand_id ORDER BY ub.brand_id) FROM user_brands ub WHERE ub.user_id = u.id), '{}'),
             u.active
        FROM users u WHERE u.id = uid;
    END $$;
    CREATE FUNCTION membership_on_user() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'INSERT' OR NEW.role IS DISTINCT FROM OLD.role OR NEW.factory_id IS DISTINCT FROM OLD.factory_id OR NEW.active IS DISTINCT FROM OLD.active THEN
        PERFORM membership_snapshot(NEW.id);
      END IF;
      RETURN NULL;
    END $$;
    CREATE FUNCTION membership_on_brands() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM membership_snapshot(CASE WHEN TG_OP = 'DELETE' THEN OLD.user_id ELSE NEW.user_id END);
      RETURN NULL;
    END $$;
    CREATE TRIGGER users_membership AFTER INSERT OR UPDATE ON users FOR EACH ROW EXECUTE FUNCTION membership_on_user();
    CREATE TRIGGER user_brands_membership AFTER INSERT OR DELETE ON user_brands FOR EACH ROW EXECUTE FUNCTION membership_on_brands();

    CREATE FUNCTION membership_history_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'membership_history is append-only'; END $$;
    CREATE TRIGGER membership_history_no_update BEFORE UPDATE OR DELETE ON membership_history
      FOR EACH ROW EXECUTE FUNCTION membership_history_append_only();
    CREATE TRIGGER membership_history_no_truncate BEFORE TRUNCATE ON membership_history
      FOR EACH STATEMENT EXECUTE FUNCTION membership_history_append_only();

    -- Users that exist already: what they hold now, from when they were created.
    INSERT INTO membership_history (user_id, role, factory_id, brand_ids, active, valid_from)
    SELECT u.id, u.role::text, u.factory_id,
           COALESCE((SELECT array_agg(ub.brand_id ORDER BY ub.brand_id) FROM user_brands ub WHERE ub.user_id = u.id), '{}'),
           u.active, u.created_at
      FROM users u;
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER IF EXISTS users_membership ON users;
    DROP TRIGGER IF EXISTS user_brands_membership ON user_brands;
    DROP TABLE IF EXISTS membership_history;
    DROP FUNCTION IF EXISTS membership_on_user(), membership_on_brands(), membership_snapshot(uuid), membership_history_append_only();
  `);
};
