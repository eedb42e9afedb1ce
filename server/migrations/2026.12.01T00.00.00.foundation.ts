import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('brands', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    code: { type: DataTypes.STRING(6), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    ...timestamps,
  });
  await qi.createTable('factories', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    city: { type: DataTypes.STRING(120), allowNull: false },
    country: { type: DataTypes.STRING(80), allowNull: false },
    time_zone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
    ...timestamps,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    email: { type: DataTypes.STRING(320), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: {
      type: DataTypes.ENUM('designer', 'engineer', 'brand_lead', 'toolmaker', 'admin'),
      allowNull: false,
    },
    password_hash: { type: DataTypes.STRING, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    time_zone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
    factory_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'factories', key: 'id' }, onDelete: 'RESTRICT' },
    invite_token_hash: { type: DataTypes.STRING(64), allowNull: true },
    invite_expires_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.sequelize.query(
    `ALTER TABLE users ADD CONSTRAINT users_toolmaker_factory CHECK ((role = 'toolmaker') = (factory_id IS NOT NULL))`,
  );
  await qi.createTable('user_brands', {
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    brand_id: { type: DataTypes.UUID, primaryKey: true, references: { model: 'brands', key: 'id' }, onDelete: 'CASCADE' },
  });
  await qi.createTable('company_settings', {
    key: { type: DataTypes.STRING(64), primaryKey: true },
    value: { type: DataTypes.JSONB, allowNull: false },
    ...timestamps,
  });
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    actor_id: { type: DataTypes.UUID, allowNull: true },
    actor_name: { type: DataTypes.STRING(120), allowNull: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity: { type: DataTypes.STRING(64), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    before: { type: DataTypes.JSONB, allowNull: true },
    after: { type: DataTypes.JSONB, allowNull: true },
  });
  await qi.addIndex('audit_events', ['entity', 'entity_id']);
  // Append-only: the app's own database role may insert and read, never rewrite.
  await qi.sequelize.query(`
    CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'audit_events is append-only'; END $$;
    CREATE TRIGGER audit_events_no_update BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only();
    CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_append_only();
    REVOKE UPDATE, DELETE, TRUNCATE ON audit_events FROM CURRENT_USER;
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('audit_events');
  await qi.sequelize.query('DROP FUNCTION IF EXISTS audit_events_append_only()');
  await qi.dropTable('company_settings');
  await qi.dropTable('user_brands');
  await qi.dropTable('users');
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_users_role"');
  await qi.dropTable('factories');
  await qi.dropTable('brands');
};
