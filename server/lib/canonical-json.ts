// Canonical JSON for hashing: object keys sorted (by UTF-16 code units, as Array.prototype.sort
// does), no whitespace, undefined object members left out, numbers and strings as JSON.stringify
// writes them. For the values hashed here (strings, safe integers, booleans, null, arrays, plain
// objects) this is the JSON Canonicalization Scheme of RFC 8785.
import { createHash } from 'node:crypto';

export function canonicalJson(value: unknown): string {
  if (value === null) return 'null';
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isFinite(value)) throw new TypeError('Canonical JSON has no form for NaN or Infinity');
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? 'null' : canonicalJson(v))).join(',')}]`;
      const obj = value as Record<string, unknown>;
      const keys = Object.keys(obj)
        .filter((k) => obj[k] !== undefined)
        .sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k])}`).join(',')}}`;
    }
    default:
      throw new TypeError(`Canonical JSON has no form for ${typeof value}`);
  }
}

export const sha256Hex = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');
