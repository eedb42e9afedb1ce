// Starts the API (and the exported web app, when built) on PORT. Used by scripts/start.ts and scripts/dev.ts.
import path from 'node:path';
import type { Server } from 'node:http';
import { createApp } from './app';
import { createSequelize } from './db';
import { env } from './env';
import { startBoss, startEmailWorker } from './jobs/outbox';
import { createTransport } from './mail/mailer';
import { initModels } from './models';
import { startSchedules } from './jobs/schedules';
import { registerStageReminders } from './jobs/stage-reminders';

/**
 * databaseUrl: what the server's own work runs as (scripts/stack.ts passes the server role, which
 * may not rewrite the record); jobsDatabaseUrl: the job queue's connection, which installs and
 * maintains its schema and so runs as the owner (default: databaseUrl).
 */
export async function startServer(opts: { port?: number; databaseUrl?: string; jobsDatabaseUrl?: string; distDir?: string } = {}) {
  const databaseUrl = opts.databaseUrl ?? env.DATABASE_URL;
  const sequelize = createSequelize(databaseUrl);
  initModels(sequelize);
  const boss = await startBoss(opts.jobsDatabaseUrl ?? databaseUrl);
  await startEmailWorker(boss, createTransport());
  registerStageReminders();
  const stopSchedules = await startSchedules({ sequelize, boss });
  const app = createApp({ sequelize, boss, distDir: opts.distDir ?? path.resolve(env.DIST_DIR) });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(opts.port ?? env.PORT, env.HOST, () => resolve(s));
  });
  return {
    server,
    async stop() {
      await new Promise<void>((r) => server.close(() => r()));
      server.closeAllConnections?.();
      stopSchedules();
      await boss.stop({ graceful: true, wait: true, timeout: 5000 });
      await sequelize.close();
    },
  };
}

if (require.main === module) {
  startServer().then(
    (server) => {
      console.log(`Toolgate API on http://localhost:${env.PORT}`);
      const bye = () => void server.stop().then(() => process.exit(0));
      process.once('SIGINT', bye);
      process.once('SIGTERM', bye);
    },
    (err) => {
      console.error('Toolgate could not start:', err);
      process.exit(1);
    },
  );
}
