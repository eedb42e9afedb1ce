// `npm start`: the whole product with demo data on http://localhost:8080. Ctrl-C stops it.
import { env } from '../server/env';
import { bringUp, buildWebIfStale, dbIsRunning, startDatabase, stopDatabase } from './stack';

async function main() {
  const t0 = Date.now();
  const dbWasRunning = dbIsRunning();
  startDatabase();
  buildWebIfStale(process.argv.includes('--rebuild'));
  const stack = await bringUp({ databaseUrl: env.DATABASE_URL, port: env.PORT, smtpPort: env.SMTP_PORT, mailHttpPort: env.MAIL_HTTP_PORT });
  console.log(`
  Toolgate is ready (${((Date.now() - t0) / 1000).toFixed(1)} s)

    App and API   http://localhost:${env.PORT}
    Mail inbox    http://localhost:${env.MAIL_HTTP_PORT}   (SMTP on 127.0.0.1:${env.SMTP_PORT})
    Database      127.0.0.1:54329 (scripts/db.sh psql)

  Demo sign-ins (password: toolgate-demo)
    designer@kestrelbay.example     engineer@kestrelbay.example
    brandlead@kestrelbay.example    toolmaker@harbourline.example
    admin@kestrelbay.example

  Ctrl-C stops everything.
`);
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    console.log('\ntoolgate: stopping...');
    await stack.stop().catch((e: Error) => console.error(e.message));
    if (!dbWasRunning) stopDatabase();
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: Error) => {
  console.error(`toolgate: could not start: ${err.message}`);
  process.exit(1);
});
