import type { Migration } from '../db/migrator';

// The audit trail is chained like the sign-offs (server/services/audit-chain.ts): each new event
// has a sequence number and an HMAC over the one before it. Events written before this migration
// stay unchained (seq null); the chain starts with the first event after it.

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE audit_events
      ADD COLUMN seq bigint,
      ADD COLUMN prev_hash varchar(64),
      ADD COLUMN hash varchar(64),
      ADD CONSTRAINT audit_events_seq_unique UNIQUE (seq),
      ADD CONSTRAINT audit_events_chain_complete CHECK ((seq IS NULL) = (hash IS NULL) AND (seq IS NULL) = (prev_hash IS NULL));
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE audit_events DROP COLUMN seq, DROP COLUMN prev_hash, DROP COLUMN hash');
};
