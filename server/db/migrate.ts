// CLI: node --import tsx server/db/migrate.ts up | down | pending | executed
import { createSequelize } from '../db';
import { createMigrator } from './migrator';

const sequelize = createSequelize();
void createMigrator(sequelize, false)
  .runAsCLI()
  .then((ok) => sequelize.close().then(() => process.exit(ok ? 0 : 1)));
