import { roleLabels, type Role } from '../../../shared/schemas/users';
import type { EmailJob } from '../../jobs/outbox';
import { escapeHtml } from '../html';

export function invitationMail(p: { to: string; name: string; role: Role; invitedBy: string; link: string; days: number }): EmailJob {
  const text = [
    `Hello ${p.name},`,
    '',
    `${p.invitedBy} has added you to Toolgate as ${roleLabels[p.role]}.`,
    `Choose your password here (the link works for ${p.days} days):`,
    p.link,
    '',
    'Toolgate records decisions about changes to injection molds.',
  ].join('\n');
  const html = `<p>Hello ${escapeHtml(p.name)},</p>
<p>${escapeHtml(p.invitedBy)} has added you to Toolgate as <strong>${escapeHtml(roleLabels[p.role])}</strong>.</p>
<p><a href="${escapeHtml(p.link)}">Choose your password</a> (the link works for ${p.days} days).</p>
<p style="color:#8795A1">Toolgate records decisions about changes to injection molds.</p>`;
  return { to: [p.to], subject: 'Toolgate: you are invited', text, html };
}
