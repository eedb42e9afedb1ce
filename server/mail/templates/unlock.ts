import type { EmailJob } from '../../jobs/outbox';
import { escapeHtml } from '../html';

/** Sent when wrong passwords locked an account: choosing a new password lifts the lock. */
export function unlockMail(p: { to: string; name: string; link: string; days: number }): EmailJob {
  const text = [
    `Hello ${p.name},`,
    '',
    'Your Toolgate account was locked because its password was entered wrongly many times.',
    `Choose a new password here to unlock it (the link works for ${p.days === 1 ? '1 day' : `${p.days} days`}):`,
    p.link,
    '',
    'If you did not try to sign in, someone else may have: tell your administrator.',
  ].join('\n');
  const html = `<p>Hello ${escapeHtml(p.name)},</p>
<p>Your Toolgate account was locked because its password was entered wrongly many times.</p>
<p><a href="${escapeHtml(p.link)}">Choose a new password to unlock it</a> (the link works for ${p.days === 1 ? '1 day' : `${p.days} days`}).</p>
<p>If you did not try to sign in, someone else may have: tell your administrator.</p>`;
  return { to: [p.to], subject: 'Toolgate: your account is locked', text, html };
}
