// Seeds the demo scenario (idempotent): `npm run db:seed`. Also called by scripts/start.ts.
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../db';
import { initModels } from '../models';
import { seedNumbers } from './numbers';
import { seedOrganisation } from './organisation';
import { seedRegistry } from './registry';
import { seedRequests } from './requests';

export async function seedDemo(sequelize: Sequelize) {
  await sequelize.transaction(async (transaction) => {
    const org = await seedOrganisation(transaction);
    const registry = await seedRegistry(transaction, org);
    await seedRequests(transaction, org, registry);
    await seedNumbers(transaction);
  });
}

if (require.main === module) {
  const sequelize = createSequelize();
  initModels(sequelize);
  seedDemo(sequelize)
    .then(() => console.log('Demo data is in place.'))
    .catch((err) => {
      console.error('Seeding failed:', err);
      process.exitCode = 1;
    })
    .finally(() => sequelize.close());
}
