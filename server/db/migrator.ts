import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

// Migrations live in server/migrations; names are recorded without their extension.
export function createMigrator(sequelize: Sequelize, quiet = true) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.{ts,js}', { cwd: path.join(__dirname, '..', 'migrations'), ignore: ['**/*.d.ts', '**/*.map'] }],
      resolve: (params) => ({ ...Umzug.defaultResolver(params), name: params.name.replace(/\.[cm]?[jt]s$/, '') }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'sequelize_meta' }),
    logger: quiet ? undefined : console,
  });
}

export type Migration = ReturnType<typeof createMigrator>['_types']['migration'];

export async function migrateUp(sequelize: Sequelize, quiet = true) {
  return createMigrator(sequelize, quiet).up();
}
