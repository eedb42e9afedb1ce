import type PgBoss from 'pg-boss';
import type { Transporter } from 'nodemailer';
import { QueryTypes } from 'sequelize';
import { EMAIL_QUEUE, enqueueEmail, startBoss, startEmailWorker, type EmailJob } from '../../server/jobs/outbox';
import { createTransport } from '../../server/mail/mailer';
import { startSmtpFake, type SmtpFake } from '../../server/mail/smtp-fake';
import { makeUser, openTestApp, request, TEST_DATABASE_URL, uid } from './helpers';

let boss: PgBoss;
let fake: SmtpFake;
let t: ReturnType<typeof openTestApp>;
let workerId: string;

const mailApi = () => request(`http://127.0.0.1:${fake.httpPort}`);
const letter = (to: string, subject: string): EmailJob => ({ to: [to], subject, text: `Body of ${subject}`, html: `<p>Body of <b>${subject}</b></p>` });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Jobs of the e-mail queue addressed to one recipient (pg-boss keeps them in pgboss.job). */
async function jobsTo(address: string) {
  return t.sequelize.query<{ state: string; retry_count: number; output: unknown }>(
    `SELECT state, retry_count, output FROM pgboss.job WHERE name = :queue AND data->'to' ? :address`,
    { replacements: { queue: EMAIL_QUEUE, address }, type: QueryTypes.SELECT },
  );
}

async function until<T>(probe: () => Promise<T | undefined | false>, timeoutMs = 8000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await sleep(100);
  }
}

beforeAll(async () => {
  fake = await startSmtpFake({ smtpPort: 0, httpPort: 0 });
  boss = await startBoss(TEST_DATABASE_URL, { retryDelaySeconds: 1 });
  workerId = await startEmailWorker(boss, createTransport({ host: '127.0.0.1', port: fake.smtpPort }), 0.5);
  t = openTestApp({ boss });
});

afterAll(async () => {
  await boss.stop({ graceful: false, wait: true });
  await fake.close();
  await t.close();
});

describe('invitation e-mail', () => {
  it('when an admin creates a user, then the invitation reaches the mail API with their address, a subject and a working set-password link', async () => {
    const { auth, user: admin } = await makeUser('admin');
    const email = `invitee-${uid()}@test.example`;
    const res = await request(t.app).post('/api/users').set(auth).send({ email, name: 'Moss Tamberlane', role: 'engineer' });
    expect(res.status).toBe(201);

    await fake.waitFor((m) => m.to.includes(email), 8000);
    const list = await mailApi().get('/api/v2/messages');
    expect(list.status).toBe(200);
    const item = list.body.items.find((i: { Raw: { To: string[] } }) => i.Raw.To.includes(email));
    expect(item.To).toEqual([{ Mailbox: email.split('@')[0], Domain: 'test.example', Params: '' }]);
    expect(item.Content.Headers.To).toEqual([email]);
    expect(item.Content.Headers.Subject[0]).toMatch(/invited/i);
    expect(item.Content.Headers['Message-ID'][0]).toMatch(/^<[0-9a-f-]{36}@toolgate\.local>$/);

    const text = await mailApi().get(`/api/v1/messages/${encodeURIComponent(item.ID)}/text`);
    expect(text.text).toContain(admin.name);
    const link = /(https?:\/\/\S+\/set-password\?token=)(\S+)/.exec(text.text);
    expect(link).not.toBeNull();
    // The link in the mail is the one that works: it sets the password and signs the invitee in.
    const set = await request(t.app).post('/api/auth/set-password').send({ token: decodeURIComponent(link![2]!), password: 'a-long-enough-secret' });
    expect(set.status).toBe(200);
    expect(set.body.user.email).toBe(email);
  });

  it('when the transaction that queued a mail rolls back, then nothing is queued and nothing is sent', async () => {
    const dropped = `dropped-${uid()}@test.example`;
    const marker = `marker-${uid()}@test.example`;
    await expect(
      t.sequelize.transaction(async (transaction) => {
        await enqueueEmail(boss, letter(dropped, 'Rolled back'), { sequelize: t.sequelize, transaction });
        throw new Error('change refused');
      }),
    ).rejects.toThrow('change refused');
    // A committed mail queued afterwards goes out; by then the rolled-back one would have too.
    await enqueueEmail(boss, letter(marker, 'Committed'));
    await fake.waitFor((m) => m.to.includes(marker), 8000);
    expect(await jobsTo(dropped)).toEqual([]);
    expect(fake.messages.filter((m) => m.to.includes(dropped))).toEqual([]);
  });
});

describe('when SMTP is down', () => {
  it('when the mail server stops, then the job retries and the mail arrives exactly once after it is back', async () => {
    const { smtpPort, httpPort } = fake;
    const address = `patient-${uid()}@test.example`;
    await fake.close();

    await enqueueEmail(boss, letter(address, 'Sent while SMTP was down'));
    // A failed attempt while nothing listens on the SMTP port, and the job waits to be retried.
    const [job] = await until(async () => {
      const jobs = await jobsTo(address);
      return jobs.length === 1 && jobs[0]!.state === 'retry' && jobs;
    });
    expect(job!.output).toMatchObject({ message: expect.stringMatching(/ECONNREFUSED/) });

    fake = await startSmtpFake({ smtpPort, httpPort });
    await fake.waitFor((m) => m.to.includes(address), 8000);
    await until(async () => (await jobsTo(address))[0]?.state === 'completed');
    await sleep(1200); // longer than the retry delay: a duplicate would have arrived by now
    expect(fake.messages.filter((m) => m.to.includes(address))).toHaveLength(1);
    const list = await mailApi().get('/api/v2/messages');
    expect(list.body.items.filter((i: { Raw: { To: string[] } }) => i.Raw.To.includes(address))).toHaveLength(1);
  });

  it('when one message of a batch is refused, then only that one is retried and the others go out once', async () => {
    await boss.offWork({ id: workerId });
    await sleep(600); // the stopped worker finishes its current poll
    const addresses = [`a-${uid()}@test.example`, `b-${uid()}@test.example`, `c-${uid()}@test.example`];
    // A transport that refuses the second message it is handed (the batch order is up to the queue),
    // so one message was sent before the refusal and one after; every call is counted.
    const calls: string[] = [];
    const transport = {
      async sendMail(m: { to: string[] }) {
        calls.push(m.to[0]!);
        if (calls.length === 2) throw new Error('450 mailbox busy');
        return {};
      },
    } as unknown as Transporter;
    // Queued before the worker starts, so its first fetch takes all three in one batch.
    for (const to of addresses) await enqueueEmail(boss, letter(to, 'Batch'));
    workerId = await startEmailWorker(boss, transport, 0.5);

    await until(async () => calls.length >= 3 && (await Promise.all(addresses.map(jobsTo))).every((j) => j[0]?.state === 'completed'), 10_000);
    await sleep(1200); // longer than the retry delay: a duplicate would have been sent by now
    const refused = calls[1]!;
    const others = addresses.filter((a) => a !== refused);
    // Precondition: the two that were not refused were fetched together, so all three shared a batch.
    const startedOn = await Promise.all(
      others.map((a) =>
        t.sequelize.query<{ started_on: Date }>(`SELECT started_on FROM pgboss.job WHERE name = :queue AND data->'to' ? :a`, {
          replacements: { queue: EMAIL_QUEUE, a },
          type: QueryTypes.SELECT,
          plain: true,
        }),
      ),
    );
    expect(startedOn[0]!.started_on).toEqual(startedOn[1]!.started_on);
    expect(calls.filter((c) => c === refused)).toHaveLength(2);
    for (const to of others) expect(calls.filter((c) => c === to)).toHaveLength(1);
  });
});

describe('mail catcher HTTP API and inbox page', () => {
  it('when messages arrive, then /api/v2/messages lists them newest first with paging, and DELETE empties it', async () => {
    const transport = createTransport({ host: '127.0.0.1', port: fake.smtpPort });
    const to = `api-${uid()}@test.example`;
    await transport.sendMail({ from: 'Toolgate <no-reply@toolgate.example>', to, subject: 'First', text: 'one' });
    await transport.sendMail({ from: 'Toolgate <no-reply@toolgate.example>', to, subject: 'Second', text: 'two', html: '<p>two</p>' });

    const res = await mailApi().get('/api/v2/messages');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: fake.messages.length, count: fake.messages.length, start: 0 });
    const [newest, older] = res.body.items;
    expect(newest.Content.Headers.Subject).toEqual(['Second']);
    expect(older.Content.Headers.Subject).toEqual(['First']);
    expect(Date.parse(newest.Created)).toBeGreaterThanOrEqual(Date.parse(older.Created));
    expect(newest).toMatchObject({
      ID: expect.any(String),
      From: { Mailbox: 'no-reply', Domain: 'toolgate.example', Params: '' },
      Content: { Headers: { From: ['Toolgate <no-reply@toolgate.example>'], 'Content-Type': [expect.stringMatching(/^multipart\/alternative/)] }, MIME: null },
      Raw: { From: 'no-reply@toolgate.example', To: [to], Helo: expect.any(String) },
    });
    expect(newest.Content.Size).toBe(Buffer.byteLength(newest.Raw.Data));
    expect(newest.Raw.Data).toContain(newest.Content.Body);
    expect(older.Content.Body.trim()).toBe('one');

    const page = await mailApi().get('/api/v2/messages').query({ start: 1, limit: 1 });
    expect(page.body).toMatchObject({ total: res.body.total, count: 1, start: 1 });
    expect(page.body.items[0].ID).toBe(older.ID);
    expect((await mailApi().get('/api/v2/messages').query({ limit: 'many' })).status).toBe(400);

    expect((await mailApi().delete('/api/v1/messages')).status).toBe(200);
    expect((await mailApi().get('/api/v2/messages')).body).toEqual({ total: 0, count: 0, start: 0, items: [] });
    expect(fake.messages).toHaveLength(0);
  });

  it('when more messages arrive than the cap, then the oldest are dropped', async () => {
    const small = await startSmtpFake({ smtpPort: 0, httpPort: 0, maxMessages: 2 });
    try {
      const transport = createTransport({ host: '127.0.0.1', port: small.smtpPort });
      for (const subject of ['One', 'Two', 'Three']) await transport.sendMail({ from: 'no-reply@toolgate.example', to: 'cap@test.example', subject, text: subject });
      const res = await request(`http://127.0.0.1:${small.httpPort}`).get('/api/v2/messages');
      expect(res.body.total).toBe(2);
      expect(res.body.items.map((i: { Content: { Headers: { Subject: string[] } } }) => i.Content.Headers.Subject[0])).toEqual(['Three', 'Two']);
    } finally {
      await small.close();
    }
  });

  it('when the inbox page is opened, then 200 HTML that reads the catcher and shows message HTML only in a sandbox', async () => {
    const res = await mailApi().get('/');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.text).toContain('<title>Toolgate local mail</title>');
    expect(res.text).toContain('Delete all');
    expect(res.text).toContain("sandbox: ''");
    expect(res.headers['content-security-policy']).toMatch(/script-src 'nonce-/);
  });

  it('when the inbox JSON asks for one message, then it has the decoded subject, text and HTML', async () => {
    const transport = createTransport({ host: '127.0.0.1', port: fake.smtpPort });
    const to = `inbox-${uid()}@test.example`;
    await transport.sendMail({ from: 'no-reply@toolgate.example', to, subject: 'Kite visor — re-cut', text: 'Plain words', html: '<p>Rich words</p>' });
    const list = await mailApi().get('/inbox/messages');
    const summary = list.body.items.find((m: { to: string[] }) => m.to.includes(to));
    expect(summary.subject).toBe('Kite visor — re-cut');
    const one = await mailApi().get(`/inbox/messages/${summary.id}`);
    expect(one.body).toMatchObject({ subject: 'Kite visor — re-cut', text: 'Plain words', html: '<p>Rich words</p>' });
    expect((await mailApi().get('/inbox/messages/nope')).status).toBe(404);
  });
});
