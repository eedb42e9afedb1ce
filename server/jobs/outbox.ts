// pg-boss as the durable e-mail outbox: a job is written in the same transaction as the change
// that caused it, and the worker retries until SMTP takes the message.
import PgBoss from 'pg-boss';
import type { Sequelize, Transaction } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { env } from '../env';

export const EMAIL_QUEUE = 'email-send';

/** A file the worker makes at send time from a reference, so the queued job stays small. */
export interface MailAttachmentRef {
  kind: 'cut_sheet';
  requestId: string;
  paper: 'a4' | 'letter';
}

export interface EmailJob {
  to: string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachmentRef[];
}

/** The files of a job, made now (the cut sheet as the record stands when the mail goes out). */
async function attachmentsOf(job: EmailJob) {
  if (!job.attachments?.length) return undefined;
  const { buildCutSheetForMail } = await import('../services/cut-sheet');
  const files = [];
  for (const a of job.attachments) {
    const sheet = await buildCutSheetForMail(a.requestId, a.paper);
    files.push({ filename: sheet.filename, content: sheet.data, contentType: 'application/pdf' });
  }
  return files;
}

export interface Outbox {
  boss: PgBoss;
  stop(): Promise<void>;
}

export async function startBoss(connectionString: string, opts: { retryDelaySeconds?: number } = {}) {
  const boss = new PgBoss({ connectionString, schema: 'pgboss', max: 4, supervise: true, schedule: false });
  boss.on('error', (err) => console.error('job queue error', err.message));
  await boss.start();
  await boss.createQueue(EMAIL_QUEUE, {
    name: EMAIL_QUEUE,
    retryLimit: 50,
    retryDelay: opts.retryDelaySeconds ?? 5,
    retryBackoff: false,
  });
  return boss;
}

// pg-boss passes undefined for unset options; Sequelize's bind refuses undefined.
function txDb(sequelize: Sequelize, transaction: Transaction): PgBoss.Db {
  return {
    async executeSql(text, values) {
      const bind = values.map((v) => (v === undefined ? null : v));
      const [rows] = await sequelize.query(text, { bind, transaction, raw: true });
      return { rows: rows as unknown[] } as { rows: never[] };
    },
  };
}

export function enqueueEmail(boss: PgBoss, job: EmailJob, tx?: { sequelize: Sequelize; transaction: Transaction }) {
  return boss.send(EMAIL_QUEUE, job, tx ? { db: txDb(tx.sequelize, tx.transaction) } : {});
}

export async function startEmailWorker(boss: PgBoss, transport: Transporter, pollingIntervalSeconds = 1) {
  return boss.work<EmailJob>(EMAIL_QUEUE, { batchSize: 5, pollingIntervalSeconds }, async (jobs) => {
    // Each sent job is completed at once: a throw fails only the jobs still active, so one
    // refused message does not make the others in the batch go out twice.
    const failures: string[] = [];
    for (const job of jobs) {
      try {
        // Message-ID from the job id: a redelivered job is recognisable downstream.
        await transport.sendMail({
          from: env.MAIL_FROM,
          to: job.data.to,
          subject: job.data.subject,
          text: job.data.text,
          html: job.data.html,
          attachments: await attachmentsOf(job.data),
          messageId: `<${job.id}@toolgate.local>`,
        });
      } catch (err) {
        failures.push(`${job.id}: ${(err as Error).message}`);
        continue;
      }
      await boss.complete(EMAIL_QUEUE, job.id);
    }
    if (failures.length) throw new Error(`SMTP refused ${failures.length} of ${jobs.length} messages; they will be retried (${failures.join('; ')})`);
  });
}
