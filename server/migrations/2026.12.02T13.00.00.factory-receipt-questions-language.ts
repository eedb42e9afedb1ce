import type { Migration } from '../db/migrator';

// The factory half of a change: the toolmaker's receipt of the cut sheet (a signature in the
// chain; the request keeps when it happened), questions between the company and the factory on a
// request, and each user's language for screens and mail.
//
// The action list of sign_offs is read from the constraint as it stands and extended, so actions
// that other migrations add are kept.

const ACTION_CHECK = 'sign_offs_action_check';

async function actionsInCheck(qi: Parameters<Migration>[0]['context']): Promise<string[]> {
  const [rows] = (await qi.sequelize.query(
    `SELECT pg_get_constraintdef(oid) AS def FROM pg_constraint WHERE conname = '${ACTION_CHECK}' AND conrelid = 'sign_offs'::regclass`,
  )) as [{ def: string }[], unknown];
  const def = rows[0]?.def ?? '';
  return [...def.matchAll(/'([a-z_]+)'/g)].map((m) => m[1]!);
}

async function setActions(qi: Parameters<Migration>[0]['context'], actions: string[]) {
  const list = [...new Set(actions)].map((a) => `'${a}'`).join(', ');
  await qi.sequelize.query(`ALTER TABLE sign_offs DROP CONSTRAINT IF EXISTS ${ACTION_CHECK}, ADD CONSTRAINT ${ACTION_CHECK} CHECK (action IN (${list}))`);
}

export const up: Migration = async ({ context: qi }) => {
  await setActions(qi, [...(await actionsInCheck(qi)), 'confirm_receipt']);
  await qi.sequelize.query(`
    ALTER TABLE change_requests ADD COLUMN cut_sheet_received_at timestamptz;

    ALTER TABLE users ADD COLUMN language varchar(16) NOT NULL DEFAULT 'en',
      ADD CONSTRAINT users_language_check CHECK (language IN ('en', 'zh-Hans'));

    CREATE TABLE request_questions (
      id uuid PRIMARY KEY,
      request_id uuid NOT NULL REFERENCES change_requests(id) ON DELETE CASCADE,
      author_id uuid NOT NULL REFERENCES users(id),
      author_role varchar(32) NOT NULL,
      side varchar(16) NOT NULL CHECK (side IN ('company', 'factory')),
      reply_to_id uuid REFERENCES request_questions(id),
      body text NOT NULL CHECK (length(body) BETWEEN 1 AND 4000),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX request_questions_request ON request_questions (request_id, created_at);

    CREATE FUNCTION request_questions_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'request_questions is append-only: a question or answer is kept as it was written'; END $$;
    CREATE TRIGGER request_questions_no_update BEFORE UPDATE OR DELETE ON request_questions
      FOR EACH ROW EXECUTE FUNCTION request_questions_append_only();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS request_questions;
    DROP FUNCTION IF EXISTS request_questions_append_only();
    ALTER TABLE users DROP CONSTRAINT IF EXISTS users_language_check, DROP COLUMN IF EXISTS language;
    ALTER TABLE change_requests DROP COLUMN IF EXISTS cut_sheet_received_at;
  `);
  await setActions(qi, (await actionsInCheck(qi)).filter((a) => a !== 'confirm_receipt'));
};
