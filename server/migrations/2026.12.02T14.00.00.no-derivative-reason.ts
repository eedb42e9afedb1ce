import type { Migration } from '../db/migrator';

// A change request may be for no product at all (a fix to the tool, a texture refresh): the
// request then says so and why, instead of leaving the derivative product open. The engineering
// review's gate reads it (shared/domain/gates.ts).

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE change_requests
      ADD COLUMN no_derivative_reason text,
      ADD CONSTRAINT change_requests_no_derivative_reason_length CHECK (no_derivative_reason IS NULL OR length(no_derivative_reason) <= 2000);
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE change_requests DROP CONSTRAINT IF EXISTS change_requests_no_derivative_reason_length, DROP COLUMN IF EXISTS no_derivative_reason;`);
};
