import { requestMail } from '../../server/mail/templates/request-transition';

describe('the record in the transition e-mail', () => {
  it('when a step is mailed, then the mail carries the sign-off number and the chain head, as a copy outside Toolgate', () => {
    const hash = 'a'.repeat(64);
    const job = requestMail({
      to: ['lead@test.example'],
      kind: 'act',
      request: { id: 'r1', ref: 'CR-0007', title: 'Visor ridge', toolCode: 'KB-T-0412', toolName: 'Kite head', status: 'brand_approval', irreversible: false, endedProducts: [], stageDueAt: null, link: 'http://localhost/requests/r1' },
      transition: { actionLabel: 'Sign engineering review', byName: 'Tomas Ilves', byRole: 'Engineer', meaning: 'Reviewed.', comment: '', at: new Date('2026-12-01T10:00:00Z'), record: { seq: 2, hash } },
      actions: ['Approve'],
    });
    expect(job.text).toContain(`sign-off 2, fingerprint ${hash}`);
    expect(job.html).toContain(hash);
  });
});
