import type { Migration } from '../db/migrator';

// The sign-off workflow: what each sign-off keeps beyond the first cut of its table (the exact
// content that was signed, and the action's own details such as the cut report or the ticked
// products), the rules that keep the chain well-formed, the revision a request is made against,
// the record of overdue reminders, and the company's due days per stage.
//
// sign_offs is append-only, like audit_events: the app's database role may insert and read, never
// rewrite. The hash chain (server/services/sign-off-chain.ts) still detects a row changed by
// someone who gets round this (a superuser, a restored backup).

export const up: Migration = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);

  await q(`
    ALTER TABLE sign_offs
      ADD COLUMN content jsonb NOT NULL DEFAULT '{}'::jsonb,
      ADD COLUMN details jsonb NOT NULL DEFAULT '{}'::jsonb,
      ADD CONSTRAINT sign_offs_seq_positive CHECK (seq >= 1),
      ADD CONSTRAINT sign_offs_hashes_hex CHECK (
        content_hash ~ '^[0-9a-f]{64}$' AND prev_hash ~ '^[0-9a-f]{64}$' AND hash ~ '^[0-9a-f]{64}$'),
      ADD CONSTRAINT sign_offs_action_check CHECK (action IN
        ('submit', 'sign_review', 'return_to_draft', 'approve', 'return', 'decline', 'record_cut', 'accept_samples', 'rework', 'withdraw')),
      ADD CONSTRAINT sign_offs_role_check CHECK (role IN ('designer', 'engineer', 'brand_lead', 'toolmaker', 'admin')),
      ADD CONSTRAINT sign_offs_content_is_object CHECK (jsonb_typeof(content) = 'object'),
      ADD CONSTRAINT sign_offs_details_is_object CHECK (jsonb_typeof(details) = 'object');
    CREATE INDEX sign_offs_user ON sign_offs (user_id, signed_at);

    CREATE FUNCTION sign_offs_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'sign_offs is append-only: a signature is never changed or removed'; END $$;
    CREATE TRIGGER sign_offs_no_update BEFORE UPDATE OR DELETE ON sign_offs
      FOR EACH ROW EXECUTE FUNCTION sign_offs_append_only();
    CREATE TRIGGER sign_offs_no_truncate BEFORE TRUNCATE ON sign_offs
      FOR EACH STATEMENT EXECUTE FUNCTION sign_offs_append_only();
  `);

  // The tool revision the change is made against, fixed at each sign-off before the cut
  // (null for a draft never signed: the tool's current revision).
  await q(`
    ALTER TABLE change_requests
      ADD COLUMN base_revision integer,
      ADD CONSTRAINT change_requests_base_revision_positive CHECK (base_revision IS NULL OR base_revision >= 1);
    CREATE INDEX change_requests_open_due ON change_requests (stage_due_at)
      WHERE status IN ('engineering_review', 'brand_approval', 'cut_authorized', 'samples_review');
  `);

  // One row per overdue reminder sent: at most one a day for each time a request enters a stage.
  await q(`
    CREATE TABLE stage_reminders (
      request_id uuid NOT NULL REFERENCES change_requests(id) ON DELETE CASCADE,
      stage_entered_at timestamptz NOT NULL,
      sent_on date NOT NULL,
      status varchar(32) NOT NULL,
      recipients integer NOT NULL DEFAULT 0,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (request_id, stage_entered_at, sent_on)
    );
  `);

  // Business days each stage may take before it is overdue (common practice, no published source).
  await q(`
    INSERT INTO company_settings (key, value, created_at, updated_at)
    VALUES ('stage_due_business_days',
            '{"engineering_review": 3, "brand_approval": 2, "cut_authorized": 10, "samples_review": 5}'::jsonb, now(), now())
    ON CONFLICT (key) DO NOTHING;
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DELETE FROM company_settings WHERE key = 'stage_due_business_days';
    DROP TABLE IF EXISTS stage_reminders;
    DROP INDEX IF EXISTS change_requests_open_due;
    ALTER TABLE change_requests DROP CONSTRAINT IF EXISTS change_requests_base_revision_positive, DROP COLUMN IF EXISTS base_revision;
    DROP TRIGGER IF EXISTS sign_offs_no_truncate ON sign_offs;
    DROP TRIGGER IF EXISTS sign_offs_no_update ON sign_offs;
    DROP FUNCTION IF EXISTS sign_offs_append_only();
    DROP INDEX IF EXISTS sign_offs_user;
    ALTER TABLE sign_offs
      DROP CONSTRAINT IF EXISTS sign_offs_details_is_object,
      DROP CONSTRAINT IF EXISTS sign_offs_content_is_object,
      DROP CONSTRAINT IF EXISTS sign_offs_role_check,
      DROP CONSTRAINT IF EXISTS sign_offs_action_check,
      DROP CONSTRAINT IF EXISTS sign_offs_hashes_hex,
      DROP CONSTRAINT IF EXISTS sign_offs_seq_positive,
      DROP COLUMN IF EXISTS details,
      DROP COLUMN IF EXISTS content;
  `);
};
