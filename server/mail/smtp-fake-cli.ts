// `npm run mail`: the local mail catcher on its own. SMTP on SMTP_HOST:SMTP_PORT (127.0.0.1:1025),
// inbox page and API on MAIL_HTTP_PORT (8025). Stops on Ctrl-C or SIGTERM.
import { env } from '../env';
import { startSmtpFake } from './smtp-fake';

async function main() {
  const fake = await startSmtpFake({ host: env.SMTP_HOST, smtpPort: env.SMTP_PORT, httpPort: env.MAIL_HTTP_PORT });
  const web = `http://${fake.host}:${fake.httpPort}`;
  console.log(`Toolgate local mail: SMTP on ${fake.host}:${fake.smtpPort}`);
  console.log(`  inbox page   ${web}/`);
  console.log(`  API          ${web}/api/v2/messages  (DELETE ${web}/api/v1/messages empties it)`);
  console.log('Messages are kept in memory only. Ctrl-C stops.');

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping the local mail catcher`);
    fake.close().then(
      () => process.exit(0),
      (err: Error) => {
        console.error('Could not stop cleanly:', err.message);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: NodeJS.ErrnoException) => {
  const hint = err.code === 'EADDRINUSE' ? ' (the port is taken: is another mail catcher running? Set SMTP_PORT / MAIL_HTTP_PORT.)' : '';
  console.error(`The local mail catcher could not start: ${err.message}${hint}`);
  process.exit(1);
});
