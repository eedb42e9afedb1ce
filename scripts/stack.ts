// Brings up the whole product in one process: PostgreSQL (scripts/db.sh), migrations, demo seed,
// the SMTP fake, the web build and the server. Used by `npm start` and by the browser tests.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { createSequelize } from '../server/db';
import { migrateUp } from '../server/db/migrator';
import { grantServerRole, serverRoleUrl } from '../server/db/roles';
import { initModels } from '../server/models';
import { seedDemo } from '../server/seed/run';
import { startSmtpFake } from '../server/mail/smtp-fake';
import { startServer } from '../server/index';

const root = path.resolve(__dirname, '..');
const say = (s: string) => console.log(`toolgate: ${s}`);

export function dbIsRunning() {
  return spawnSync('bash', [path.join(root, 'scripts/db.sh'), 'status'], { stdio: 'ignore' }).status === 0;
}

export function startDatabase() {
  const r = spawnSync('bash', [path.join(root, 'scripts/db.sh'), 'start'], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (r.status !== 0) throw new Error('PostgreSQL did not start (see the lines above)');
}

export function stopDatabase() {
  spawnSync('bash', [path.join(root, 'scripts/db.sh'), 'stop'], { stdio: 'inherit' });
}

function newestMtime(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return fs.readdirSync(p).reduce((m, f) => Math.max(m, newestMtime(path.join(p, f))), st.mtimeMs);
}

/** Exports the web app when dist/ is missing or older than its sources. */
export function buildWebIfStale(force = false) {
  const dist = path.join(root, 'dist', 'index.html');
  const sources = ['app', 'src', 'shared', 'assets', 'app.json', 'package.json'].map((p) => newestMtime(path.join(root, p)));
  if (!force && fs.existsSync(dist) && fs.statSync(dist).mtimeMs > Math.max(...sources)) {
    say('web build is up to date (dist/)');
    return;
  }
  say('building the web app (expo export, about a minute the first time)...');
  const t0 = Date.now();
  const r = spawnSync('npx', ['expo', 'export', '--platform', 'web'], {
    cwd: root,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1', CI: '1' },
  });
  if (r.status !== 0) throw new Error('the web build failed (see the lines above)');
  say(`web app built in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

export async function migrateAndSeed(databaseUrl: string) {
  const sequelize = createSequelize(databaseUrl);
  initModels(sequelize);
  try {
    const done = await migrateUp(sequelize);
    say(done.length ? `applied ${done.length} migration(s)` : 'database schema is up to date');
    await seedDemo(sequelize);
    say('demo data is in place');
    // The server runs as its own role, which may read and insert into the record but never rewrite it.
    const roles = spawnSync('bash', [path.join(root, 'scripts/db.sh'), 'roles'], { stdio: ['ignore', 'ignore', 'inherit'] });
    if (roles.status !== 0) throw new Error('the server database role could not be made (see the lines above)');
    await grantServerRole(sequelize);
  } finally {
    await sequelize.close();
  }
}

export async function bringUp(opts: { databaseUrl: string; port: number; smtpPort: number; mailHttpPort: number }) {
  await migrateAndSeed(opts.databaseUrl);
  const mail = await startSmtpFake({ smtpPort: opts.smtpPort, httpPort: opts.mailHttpPort });
  const server = await startServer({
    port: opts.port,
    databaseUrl: serverRoleUrl(opts.databaseUrl),
    jobsDatabaseUrl: opts.databaseUrl,
    distDir: process.env.DIST_DIR || path.join(root, 'dist'),
  });
  return {
    async stop() {
      await server.stop();
      await mail.close();
    },
  };
}
