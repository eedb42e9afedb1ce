// The release mail to the factory carries the cut sheet, made by the worker at send time.
import { execFileSync } from 'node:child_process';
import { simpleParser } from 'mailparser';
import type PgBoss from 'pg-boss';
import { startBoss, startEmailWorker } from '../../server/jobs/outbox';
import { createTransport } from '../../server/mail/mailer';
import { startSmtpFake, type SmtpFake } from '../../server/mail/smtp-fake';
import { ChangeRequestModel } from '../../server/models';
import { openTestApp, TEST_DATABASE_URL } from './helpers';
import { makeScene } from './request-fixtures';
import { actWith, requestIn } from './workflow-fixtures';

let boss: PgBoss;
let fake: SmtpFake;
let t: ReturnType<typeof openTestApp>;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  fake = await startSmtpFake({ smtpPort: 0, httpPort: 0, maxMessages: 100_000 });
  boss = await startBoss(TEST_DATABASE_URL, { retryDelaySeconds: 1 });
  await startEmailWorker(boss, createTransport({ host: '127.0.0.1', port: fake.smtpPort }), 0.5);
  t = openTestApp({ boss });
});

afterAll(async () => {
  await boss.stop({ graceful: false, wait: true });
  await fake.close();
  await t.close();
});

async function mailTo(email: string, subjectEnd: string, timeoutMs = 15_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const m = fake.messages.find((x) => x.to.includes(email) && x.subject.endsWith(subjectEnd));
    if (m) return m;
    if (Date.now() > deadline) throw new Error(`No mail "${subjectEnd}" to ${email}`);
    await sleep(100);
  }
}

describe('release mail with the cut sheet', () => {
  it('when the brand approves, then the mail to the factory carries the cut sheet PDF of that request; mail to others carries none', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'brand_approval', 'ridge');
    const res = await actWith(t.app)(s.users.lead, id, 'approve');
    expect(res.status).toBe(201);
    const r = (await ChangeRequestModel.findByPk(id))!;
    const toFactory = await mailTo(s.users.toolmaker.user.email, ': Cleared to cut');
    const parsed = await simpleParser(toFactory.raw);
    const pdfs = parsed.attachments.filter((a) => a.contentType === 'application/pdf');
    expect(pdfs).toHaveLength(1);
    expect(pdfs[0]!.filename).toMatch(/cut-sheet-a4\.pdf$/);
    const text = execFileSync(process.execPath, [`${__dirname}/pdf-text.mjs`], { input: pdfs[0]!.content }).toString();
    const body = JSON.parse(text) as { text: string };
    expect(body.text).toContain(s.tool.code);
    expect(body.text).toContain(`CR-${String(r.number).padStart(4, '0')}`);
    expect(body.text).toContain('改模单');
    expect(body.text).not.toContain('NOT FOR CUTTING');

    // The designer hears of the same step, without the file.
    const toDesigner = await mailTo(s.users.designer.user.email, ': Cleared to cut');
    expect(toDesigner.subject).toBe(toFactory.subject);
    expect((await simpleParser(toDesigner.raw)).attachments).toHaveLength(0);
  });
});
