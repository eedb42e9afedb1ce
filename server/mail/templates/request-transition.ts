// Mail about a change request moving on (or overdue in its stage): to the people who must act
// next, and to the submitter for information. Plain text and HTML say the same; the subject names
// the tool, the request and its new state, and starts with [CANNOT BE UNDONE] when the change
// cannot be undone.
import { stateLabel, type RequestState } from '../../../shared/domain/lifecycle';
import { formatCents } from '../../../shared/domain/money';
import type { EmailJob } from '../../jobs/outbox';
import { escapeHtml } from '../html';

export const IRREVERSIBLE_SUBJECT_PREFIX = '[CANNOT BE UNDONE] ';

export interface RequestMailFacts {
  id: string;
  ref: string;
  title: string;
  toolCode: string;
  toolName: string;
  status: RequestState;
  irreversible: boolean;
  /** "SR-1001 Ranger Kite" for each product the change ends. */
  endedProducts: string[];
  stageDueAt: Date | null;
  link: string;
}

export interface TransitionFacts {
  actionLabel: string;
  byName: string;
  byRole: string;
  meaning: string;
  comment: string;
  at: Date;
  /** For a recorded cut. */
  cut?: { actualCostCents: number; cutOn: string; note: string } | null;
  /** The request's record after this step: a copy of the chain head outside Toolgate. */
  record?: { seq: number; hash: string };
}

export type RequestMailKind = 'act' | 'info' | 'reminder';

export interface RequestMailInput {
  to: string[];
  kind: RequestMailKind;
  request: RequestMailFacts;
  /** What just happened (not for a reminder). */
  transition?: TransitionFacts;
  /** Labels of the actions the recipients may take ("Approve the change", ...). */
  actions?: string[];
}

/** "2026-12-01 14:03 UTC" */
export const utcText = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

const orList = (xs: readonly string[]) => (xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} or ${xs[xs.length - 1]}`);
const andList = (xs: readonly string[]) => (xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`);

export function requestMailSubject(kind: RequestMailKind, r: Pick<RequestMailFacts, 'irreversible' | 'toolCode' | 'ref' | 'title' | 'status'>) {
  const prefix = r.irreversible ? IRREVERSIBLE_SUBJECT_PREFIX : '';
  const overdue = kind === 'reminder' ? 'Overdue: ' : '';
  return `${prefix}${overdue}${r.toolCode} ${r.ref} ${r.title}: ${stateLabel(r.status)}`;
}

export function requestMail(p: RequestMailInput): EmailJob {
  const r = p.request;
  const state = stateLabel(r.status);
  const due = r.stageDueAt ? ` It is due by ${utcText(r.stageDueAt)}.` : '';
  const lines: string[] = [];
  const html: string[] = [];

  if (r.irreversible) {
    const ends = r.endedProducts.length
      ? ` It ends ${andList(r.endedProducts)}: they can no longer be made from tool ${r.toolCode}.`
      : ' It ends no product in line or planned.';
    lines.push(`THIS CHANGE CANNOT BE UNDONE.${ends}`, '');
    html.push(
      `<p style="border-left:4px solid #C2410C;padding:8px 12px;color:#C2410C;font-weight:600">This change cannot be undone.${escapeHtml(ends)}</p>`,
    );
  }

  const headline =
    p.kind === 'reminder'
      ? `${r.ref} "${r.title}" on tool ${r.toolCode} (${r.toolName}) is overdue in its stage: ${state}.${r.stageDueAt ? ` It was due by ${utcText(r.stageDueAt)}.` : ''}`
      : `${r.ref} "${r.title}" on tool ${r.toolCode} (${r.toolName}) is now: ${state}.`;
  lines.push(headline);
  html.push(`<p>${escapeHtml(headline)}</p>`);

  const t = p.transition;
  if (t) {
    const who = `${t.byName} (${t.byRole}) took "${t.actionLabel}" on ${utcText(t.at)}:`;
    lines.push('', who, `"${t.meaning}"`);
    html.push(`<p>${escapeHtml(who)}</p><blockquote style="margin:0 0 12px 0;padding-left:12px;border-left:3px solid #8795A1">${escapeHtml(t.meaning)}</blockquote>`);
    if (t.comment) {
      lines.push(`Comment: ${t.comment}`);
      html.push(`<p><strong>Comment:</strong> ${escapeHtml(t.comment)}</p>`);
    }
    if (t.cut) {
      const cut = `Cut on ${t.cut.cutOn}, actual cost ${formatCents(t.cut.actualCostCents)}.${t.cut.note ? ` ${t.cut.note}` : ''}`;
      lines.push(cut);
      html.push(`<p>${escapeHtml(cut)}</p>`);
    }
    if (t.record) {
      const rec = `Record after this step: sign-off ${t.record.seq}, fingerprint ${t.record.hash}. Keep this e-mail: the record check on the request can be compared with it.`;
      lines.push(rec);
      html.push(`<p style="color:#52606D;font-size:12px">${escapeHtml(rec)}</p>`);
    }
  }

  const ask =
    p.kind === 'info'
      ? 'You get this because you wrote the request; nothing waits for you now.'
      : `It waits for you: ${orList(p.actions ?? [])}.${p.kind === 'act' ? due : ''}`;
  lines.push('', ask, '', `Open the request: ${r.link}`, '', 'Toolgate records decisions about changes to injection molds.');
  html.push(
    `<p><strong>${escapeHtml(ask)}</strong></p>`,
    `<p><a href="${escapeHtml(r.link)}" style="display:inline-block;padding:10px 16px;background:#0F766E;color:#FFFFFF;text-decoration:none;border-radius:6px">Open ${escapeHtml(r.ref)}</a></p>`,
    `<p style="color:#8795A1">${escapeHtml(r.link)}<br>Toolgate records decisions about changes to injection molds.</p>`,
  );

  return {
    to: p.to,
    subject: requestMailSubject(p.kind, r),
    text: lines.join('\n'),
    html: `<div style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#17212B">${html.join('\n')}</div>`,
  };
}
