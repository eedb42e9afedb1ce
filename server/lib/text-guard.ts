// Text PostgreSQL cannot store is refused at the door, with the field it was found in: a NUL
// character (text columns cannot hold it, JSON columns refuse "\u0000") and a lone UTF-16
// surrogate (half of an emoji or other character, which is not valid Unicode). Refusing, rather
// than silently removing, keeps what is stored equal to what the sender meant; the message says
// what to do. Checked on JSON bodies, query strings and CSV text, before any route or audit sees it.
import type { RequestHandler } from 'express';
import { AppError } from './errors';

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be stored, or null when it can. */
export function unstorableText(s: string): string | null {
  if (s.includes('\u0000')) return 'Contains an invisible NUL character: remove it (retype the text, or save the file again as UTF-8) and send it again';
  if (LONE_SURROGATE.test(s)) return 'Contains a broken character (half of an emoji or symbol): retype that part and send it again';
  return null;
}

/** Every place in a parsed value where text cannot be stored, by path ("items.0.note"). */
export function findUnstorableText(value: unknown, path: string[] = [], out: Record<string, string[]> = {}, depth = 0): Record<string, string[]> {
  if (depth > 64) return out;
  if (typeof value === 'string') {
    const why = unstorableText(value);
    if (why) (out[path.join('.') || '_'] ??= []).push(why);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => findUnstorableText(v, [...path, String(i)], out, depth + 1));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const why = unstorableText(k);
      if (why) (out[[...path, '_key'].join('.')] ??= []).push(why);
      findUnstorableText(v, [...path, k], out, depth + 1);
    }
  }
  return out;
}

export function refuseUnstorable(fieldErrors: Record<string, string[]>) {
  const fields = Object.keys(fieldErrors);
  if (!fields.length) return;
  throw new AppError('validation_failed', `Nothing was saved: ${fieldErrors[fields[0]!]![0]!.charAt(0).toLowerCase()}${fieldErrors[fields[0]!]![0]!.slice(1)}.`, 400, fieldErrors);
}

/** After the JSON parser: the body and the query string. */
export const refuseUnstorableText: RequestHandler = (req, _res, next) => {
  refuseUnstorable({ ...findUnstorableText(req.query), ...findUnstorableText(req.body) });
  next();
};
