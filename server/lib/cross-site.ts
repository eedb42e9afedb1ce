// Cross-site writes are refused before any route runs.
//
// 1. A state-changing request (POST, PUT, PATCH, DELETE) that carries the session cookie and no
//    Bearer token must come from the app's own origin: the Origin header (or, without it, the
//    Referer) must be PUBLIC_URL's origin, the origin the request was sent to, or the dev web
//    origin. A browser always sends Origin with a cross-site POST, so a form or fetch on another
//    site that rides on the cookie is refused; Sec-Fetch-Site "cross-site" is refused as well.
// 2. Every state-changing request with a body must say it is the type its route reads: JSON
//    everywhere, a multipart form only for photo uploads, CSV (or JSON) only for the import. A
//    text/plain or form-encoded body, the kinds a page on another site may send without asking,
//    never reaches a route.
import type { Request, RequestHandler } from 'express';
import { SESSION_COOKIE } from './auth';
import { AppError } from './errors';

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The media types each route accepts (path below /api); anything else reads JSON only. */
const BODY_TYPES: { method: string; path: RegExp; types: string[]; what: string }[] = [
  { method: 'POST', path: /^\/requests\/[^/]+\/attachments\/?$/, types: ['multipart/form-data'], what: 'a photo sent as a multipart form' },
  { method: 'POST', path: /^\/registry\/import\/?$/, types: ['text/csv', 'application/csv', 'application/vnd.ms-excel', 'application/json'], what: 'a CSV file (text/csv)' },
];
const JSON_ONLY = { types: ['application/json'], what: 'JSON (application/json)' };

const hasBody = (req: Request) => req.headers['transfer-encoding'] !== undefined || (req.headers['content-length'] !== undefined && req.headers['content-length'] !== '0');

function originOf(value: string | undefined): string | null {
  if (!value) return null;
  try {
    return new URL(value).origin;
  } catch {
    return 'invalid';
  }
}

export function crossSiteGuard(opts: { publicUrl: string; devWebOrigin?: string }): RequestHandler {
  const fixed = new Set([new URL(opts.publicUrl).origin, ...(opts.devWebOrigin ? [new URL(opts.devWebOrigin).origin] : [])]);
  return (req, _res, next) => {
    if (!UNSAFE.has(req.method)) return next();

    const cookies = req.cookies as Record<string, string> | undefined;
    const bySessionCookie = Boolean(cookies?.[SESSION_COOKIE]) && !req.get('authorization')?.startsWith('Bearer ');
    if (bySessionCookie) {
      const own = `${req.protocol}://${req.get('host')}`;
      const origin = req.get('origin') ? originOf(req.get('origin')) : originOf(req.get('referer'));
      const crossSite = req.get('sec-fetch-site') === 'cross-site';
      if (crossSite || (origin !== null && origin !== own && !fixed.has(origin))) {
        throw new AppError('forbidden', 'This change was sent from another website and was refused. Open Toolgate itself and try again there.', 403);
      }
    }

    if (hasBody(req)) {
      const rule = BODY_TYPES.find((b) => b.method === req.method && b.path.test(req.path)) ?? JSON_ONLY;
      if (!req.is(rule.types)) {
        throw new AppError('unsupported_media_type', `This request must be sent as ${rule.what}. Send it again from Toolgate's own screens.`, 415);
      }
    }
    next();
  };
}
