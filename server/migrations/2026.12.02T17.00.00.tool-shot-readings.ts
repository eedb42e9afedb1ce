import type { Migration } from '../db/migrator';

// Shot-counter readings of a tool, reported by the factory, the engineer or a recorded step (a cut,
// a handover, an arrival). A counter never runs backwards: the service refuses a reading below the
// tool's last one, and the table keeps readings non-negative. Readings are history: append-only.

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE tool_shot_readings (
      id uuid PRIMARY KEY,
      tool_id uuid NOT NULL REFERENCES tools(id) ON DELETE RESTRICT,
      reading bigint NOT NULL,
      prior_reading bigint NOT NULL,
      read_at timestamptz NOT NULL,
      source varchar(16) NOT NULL,
      recorded_by uuid REFERENCES users(id) ON DELETE RESTRICT,
      request_id uuid,
      note text,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT tool_shot_readings_non_negative CHECK (reading >= 0 AND prior_reading >= 0),
      CONSTRAINT tool_shot_readings_forward CHECK (reading >= prior_reading),
      CONSTRAINT tool_shot_readings_source_known CHECK (source IN ('factory', 'engineer', 'cut', 'handover', 'arrival', 'trial'))
    );
    CREATE INDEX tool_shot_readings_tool ON tool_shot_readings (tool_id, created_at DESC);
    CREATE FUNCTION tool_shot_readings_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'tool_shot_readings is append-only'; END $$;
    CREATE TRIGGER tool_shot_readings_no_change BEFORE UPDATE OR DELETE ON tool_shot_readings
      FOR EACH ROW EXECUTE FUNCTION tool_shot_readings_append_only();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE tool_shot_readings;
    DROP FUNCTION tool_shot_readings_append_only();
  `);
};
