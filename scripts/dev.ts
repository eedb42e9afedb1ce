// `npm run dev`: database, mail fake, the API with reload on 8080 and Expo's dev server
// (web, fast refresh) on 8081, whose API calls go to 8080 (EXPO_PUBLIC_API_URL).
import { spawn, type ChildProcess } from 'node:child_process';
import { env } from '../server/env';
import { migrateAndSeed, startDatabase } from './stack';
import { startSmtpFake } from '../server/mail/smtp-fake';

async function main() {
  startDatabase();
  await migrateAndSeed(env.DATABASE_URL);
  const mail = await startSmtpFake({ smtpPort: env.SMTP_PORT, httpPort: env.MAIL_HTTP_PORT });
  const children: ChildProcess[] = [
    spawn('node', ['--import', 'tsx', '--watch', 'server/index.ts'], {
      stdio: 'inherit',
      env: { ...process.env, DEV_WEB_ORIGIN: 'http://localhost:8081', DIST_DIR: '.no-dist' },
    }),
    spawn('npx', ['expo', 'start', '--web', '--port', '8081'], {
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1', EXPO_PUBLIC_API_URL: `http://localhost:${env.PORT}` },
    }),
  ];
  console.log(`toolgate dev: web http://localhost:8081 · API http://localhost:${env.PORT} · mail http://localhost:${env.MAIL_HTTP_PORT}`);
  const stop = () => {
    children.forEach((c) => c.kill('SIGTERM'));
    void mail.close().then(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: Error) => {
  console.error(`toolgate dev: ${err.message}`);
  process.exit(1);
});
