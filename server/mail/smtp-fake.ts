// Local mail catcher for development and tests: an SMTP server that keeps every message in memory,
// an HTTP API in the shape of the common local mail-catcher API (GET /api/v2/messages,
// DELETE /api/v1/messages) and a small inbox page at GET /.
// Plain SMTP on loopback: no TLS, no authentication. Never expose it beyond 127.0.0.1.
import { randomBytes, randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject, type EmailAddress } from 'mailparser';
import { SMTPServer, type SMTPServerAddress } from 'smtp-server';
import { inboxPage } from './smtp-fake-page';

/** One captured message: the raw data plus the parsed fields the inbox page and tests use. */
export interface CapturedMail {
  id: string;
  createdAt: string;
  helo: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  /** Parsed From header, e.g. `Toolgate <no-reply@toolgate.example>`. */
  from: string;
  /** Addresses in the To header (falls back to the envelope recipients). */
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  /** Every header as it arrived, unfolded, keyed by its name as written; repeated headers keep every value. */
  headers: Record<string, string[]>;
  /** The raw body: everything after the header block. */
  body: string;
  raw: string;
  size: number;
}

export interface SmtpFakeOptions {
  host?: string;
  smtpPort?: number;
  httpPort?: number;
  /** Oldest messages are dropped beyond this many. */
  maxMessages?: number;
}

export interface SmtpFake {
  host: string;
  smtpPort: number;
  httpPort: number;
  /** Oldest first; the same array for the fake's lifetime. */
  messages: CapturedMail[];
  waitFor(pred: (m: CapturedMail) => boolean, timeoutMs?: number): Promise<CapturedMail>;
  clear(): void;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;
const DEFAULT_LIMIT = 50;

/** Splits the raw message into its unfolded headers and its body (RFC 5322 section 2.2.3). */
export function splitRawMessage(raw: string): { headers: Record<string, string[]>; body: string } {
  const end = /\r?\n\r?\n/.exec(raw);
  const head = end ? raw.slice(0, end.index) : raw;
  const body = end ? raw.slice(end.index + end[0].length) : '';
  const fields: [string, string][] = [];
  for (const line of head.split(/\r?\n/)) {
    const last = fields[fields.length - 1];
    if (/^[ \t]/.test(line) && last) {
      last[1] += line; // unfolding removes only the line break
      continue;
    }
    const colon = line.indexOf(':');
    if (colon > 0) fields.push([line.slice(0, colon).trim(), line.slice(colon + 1)]);
  }
  const headers: Record<string, string[]> = {};
  for (const [name, value] of fields) (headers[name] ??= []).push(value.trim());
  return { headers, body };
}

function addressesOf(field: AddressObject | AddressObject[] | undefined): string[] {
  const flat = (list: EmailAddress[]): string[] => list.flatMap((a) => (a.group ? flat(a.group) : a.address ? [a.address] : []));
  if (!field) return [];
  return (Array.isArray(field) ? field : [field]).flatMap((o) => flat(o.value));
}

function mailPath(address: string) {
  const at = address.lastIndexOf('@');
  return at < 0 ? { Mailbox: address, Domain: '', Params: '' } : { Mailbox: address.slice(0, at), Domain: address.slice(at + 1), Params: '' };
}

/** A message in the mail-catcher API's shape. */
export function toApiMessage(m: CapturedMail) {
  return {
    ID: m.id,
    From: m.envelopeFrom === null ? null : mailPath(m.envelopeFrom),
    To: m.envelopeTo.map(mailPath),
    Content: { Headers: m.headers, Body: m.body, Size: m.size, MIME: null },
    Created: m.createdAt,
    MIME: null,
    Raw: { From: m.envelopeFrom ?? '', To: m.envelopeTo, Data: m.raw, Helo: m.helo },
  };
}

function summaryOf(m: CapturedMail) {
  return { id: m.id, createdAt: m.createdAt, from: m.from, to: m.to, subject: m.subject, size: m.size };
}

class BadQuery extends Error {}

function intParam(url: URL, name: string, fallback: number, max: number) {
  const v = url.searchParams.get(name);
  if (v === null || v === '') return fallback;
  if (!/^\d+$/.test(v)) throw new BadQuery(`${name} must be a whole number of 0 or more`);
  return Math.min(Number(v), max);
}

function sendJson(res: http.ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
  res.end(JSON.stringify(body));
}

function sendError(res: http.ServerResponse, status: number, code: string, message: string) {
  sendJson(res, status, { error: { code, message } });
}

export async function startSmtpFake(opts: SmtpFakeOptions = {}): Promise<SmtpFake> {
  const host = opts.host ?? '127.0.0.1';
  const maxMessages = opts.maxMessages ?? 1000;
  const messages: CapturedMail[] = [];
  const waiters = new Set<() => void>();

  const smtp = new SMTPServer({
    banner: 'Toolgate local mail (keeps messages in memory)',
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    hideSTARTTLS: true,
    logger: false,
    size: MAX_MESSAGE_BYTES,
    closeTimeout: 1000,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          const err = Object.assign(new Error('Message too large for the local mail catcher'), { responseCode: 552 });
          callback(err);
          return;
        }
        const rawBytes = Buffer.concat(chunks);
        const raw = rawBytes.toString('utf8');
        simpleParser(rawBytes)
          .then((p) => {
            const envelopeTo = session.envelope.rcptTo.map((r: SMTPServerAddress) => r.address);
            const headerTo = addressesOf(p.to);
            const mailFrom = session.envelope.mailFrom;
            const { headers, body } = splitRawMessage(raw);
            messages.push({
              id: randomUUID(),
              createdAt: new Date().toISOString(),
              helo: session.hostNameAppearsAs || '',
              envelopeFrom: mailFrom ? mailFrom.address : null,
              envelopeTo,
              from: p.from?.text ?? '',
              to: headerTo.length ? headerTo : envelopeTo,
              subject: p.subject ?? '',
              text: p.text ?? '',
              html: typeof p.html === 'string' ? p.html : null,
              messageId: p.messageId ?? null,
              headers,
              body,
              raw,
              size: rawBytes.length,
            });
            if (messages.length > maxMessages) messages.splice(0, messages.length - maxMessages);
            callback();
            waiters.forEach((w) => w());
          })
          .catch((err: Error) => callback(err));
      });
    },
  });

  const newestFirst = () => [...messages].reverse();
  const byId = (id: string) => messages.find((m) => m.id === id);

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    const path = url.pathname.replace(/\/+$/, '') || '/';
    const method = req.method ?? 'GET';
    const idMatch = /^\/api\/v1\/messages\/([^/]+)(?:\/(text|html))?$/.exec(path) ?? /^\/inbox\/messages\/([^/]+)$/.exec(path);
    try {
      if (method === 'GET' && path === '/') {
        const nonce = randomBytes(16).toString('base64');
        res.writeHead(200, {
          'content-type': 'text/html; charset=utf-8',
          'cache-control': 'no-store',
          // The message HTML is shown in a sandboxed srcdoc frame, which inherits this policy:
          // no scripts of its own and no remote images.
          'content-security-policy': `default-src 'none'; script-src 'nonce-${nonce}'; style-src 'unsafe-inline'; img-src data:; connect-src 'self'; frame-src 'self'; base-uri 'none'; form-action 'none'`,
          'x-content-type-options': 'nosniff',
        });
        res.end(inboxPage(nonce));
      } else if (method === 'GET' && path === '/api/v2/messages') {
        const start = intParam(url, 'start', 0, Number.MAX_SAFE_INTEGER);
        const limit = intParam(url, 'limit', DEFAULT_LIMIT, maxMessages);
        const items = newestFirst().slice(start, start + limit).map(toApiMessage);
        sendJson(res, 200, { total: messages.length, count: items.length, start, items });
      } else if (method === 'GET' && path === '/api/v2/search') {
        const kind = url.searchParams.get('kind');
        const query = (url.searchParams.get('query') ?? '').toLowerCase();
        if (!['from', 'to', 'containing'].includes(kind ?? '') || !query) throw new BadQuery('Give kind=from|to|containing and a query');
        const hit = (m: CapturedMail) =>
          kind === 'from'
            ? `${m.envelopeFrom ?? ''} ${(m.headers.From ?? []).join(' ')}`.toLowerCase().includes(query)
            : kind === 'to'
              ? `${m.envelopeTo.join(' ')} ${(m.headers.To ?? []).join(' ')}`.toLowerCase().includes(query)
              : m.raw.toLowerCase().includes(query) || `${m.subject}\n${m.text}\n${m.html ?? ''}`.toLowerCase().includes(query);
        const found = newestFirst().filter(hit);
        const start = intParam(url, 'start', 0, Number.MAX_SAFE_INTEGER);
        const limit = intParam(url, 'limit', DEFAULT_LIMIT, maxMessages);
        const items = found.slice(start, start + limit).map(toApiMessage);
        sendJson(res, 200, { total: found.length, count: items.length, start, items });
      } else if (method === 'GET' && path === '/api/v1/messages') {
        sendJson(res, 200, newestFirst().map(toApiMessage));
      } else if (method === 'DELETE' && path === '/api/v1/messages') {
        messages.length = 0;
        res.writeHead(200, { 'content-type': 'text/plain; charset=utf-8' }).end();
      } else if (method === 'GET' && path === '/inbox/messages') {
        sendJson(res, 200, { total: messages.length, items: newestFirst().map(summaryOf) });
      } else if (idMatch) {
        const m = byId(decodeURIComponent(idMatch[1]!));
        const part = path.startsWith('/inbox/') ? 'detail' : (idMatch[2] ?? 'message');
        if (method === 'DELETE' && part === 'message') {
          if (!m) return sendError(res, 404, 'not_found', 'No message with that ID');
          messages.splice(messages.indexOf(m), 1);
          res.writeHead(200, { 'content-type': 'text/plain; charset=utf-8' }).end();
        } else if (method !== 'GET') {
          sendError(res, 405, 'method_not_allowed', `${method} is not supported here`);
        } else if (!m) {
          sendError(res, 404, 'not_found', 'No message with that ID');
        } else if (part === 'message') {
          sendJson(res, 200, toApiMessage(m));
        } else if (part === 'detail') {
          sendJson(res, 200, { ...summaryOf(m), text: m.text, html: m.html });
        } else if (part === 'text') {
          res.writeHead(200, { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store' }).end(m.text);
        } else if (m.html === null) {
          sendError(res, 404, 'not_found', 'This message has no HTML part');
        } else {
          // Opened directly, the message HTML runs in a sandbox without scripts.
          res
            .writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'content-security-policy': "sandbox; default-src 'none'; style-src 'unsafe-inline'; img-src data:" })
            .end(m.html);
        }
      } else {
        sendError(res, 404, 'not_found', `Nothing at ${method} ${path}. Try GET /api/v2/messages or the inbox at /.`);
      }
    } catch (err) {
      if (err instanceof BadQuery) sendError(res, 400, 'validation_failed', err.message);
      else sendError(res, 500, 'internal', 'The local mail catcher failed to answer');
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(opts.smtpPort ?? 1025, host, () => {
      smtp.server.off('error', reject);
      resolve();
    });
  });
  try {
    await new Promise<void>((resolve, reject) => {
      web.once('error', reject);
      web.listen(opts.httpPort ?? 8025, host, () => {
        web.off('error', reject);
        resolve();
      });
    });
  } catch (err) {
    await new Promise<void>((r) => smtp.close(() => r()));
    throw err;
  }

  let closed: Promise<void> | undefined;
  return {
    host,
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (web.address() as AddressInfo).port,
    messages,
    waitFor(pred, timeoutMs = 5000) {
      return new Promise((resolve, reject) => {
        const check = () => {
          const m = messages.find(pred);
          if (!m) return;
          waiters.delete(check);
          clearTimeout(timer);
          resolve(m);
        };
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`No matching mail arrived within ${timeoutMs} ms (${messages.length} held)`));
        }, timeoutMs);
        waiters.add(check);
        check();
      });
    },
    clear() {
      messages.length = 0;
    },
    close() {
      closed ??= (async () => {
        await new Promise<void>((r) => smtp.close(() => r()));
        await new Promise<void>((r) => {
          web.close(() => r());
          web.closeAllConnections();
        });
      })();
      return closed;
    },
  };
}
