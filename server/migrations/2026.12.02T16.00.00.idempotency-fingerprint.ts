import type { Migration } from '../db/migrator';

// A retried action must be the same action: each sign-off written under an Idempotency-Key keeps a
// SHA-256 of the request body it answered (the signing password left out), so a key reused with a
// different body is refused instead of silently replaying the first answer.

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE sign_offs ADD COLUMN idempotency_fingerprint varchar(64),
      ADD CONSTRAINT sign_offs_idempotency_fingerprint_hex CHECK (idempotency_fingerprint IS NULL OR idempotency_fingerprint ~ '^[0-9a-f]{64}$');
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE sign_offs DROP COLUMN idempotency_fingerprint');
};
