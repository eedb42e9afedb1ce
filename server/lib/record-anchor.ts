// Chain heads kept outside the database. Every new head of a sign-off chain is appended, once its
// transaction has committed, as one line to an append-only file (RECORD_ANCHOR_FILE): someone who
// can rewrite the database but not this file can neither drop the last sign-offs (the anchored
// head is then missing) nor re-chain them (the anchored fingerprint no longer matches). Each line
// carries its own HMAC, so a line cannot be forged without the key either. A head that never
// reached the file (a crash between commit and append) only makes the anchor lag: it is a lower
// bound, never a false alarm.
import fs from 'node:fs';
import path from 'node:path';
import { createHmac } from 'node:crypto';
import { canonicalJson } from './canonical-json';

export interface Anchor {
  /** What the head belongs to: a request's sign-off chain, or the audit trail. */
  chain: 'sign_offs' | 'audit_events';
  id: string;
  seq: number;
  hash: string;
  at: string;
}

export interface AnchorStore {
  file: string;
  key: string;
}

const macOf = (key: string, a: Anchor) => createHmac('sha256', key).update(canonicalJson(a)).digest('hex');

export function appendAnchor(store: AnchorStore, a: Anchor) {
  fs.mkdirSync(path.dirname(path.resolve(store.file)), { recursive: true });
  // O_APPEND: each line is written at the end in one call, whatever else writes the file.
  fs.appendFileSync(store.file, `${JSON.stringify({ ...a, mac: macOf(store.key, a) })}\n`, { flag: 'a' });
}

/** The anchors of one chain, in the order written; lines whose HMAC does not match are reported. */
export function readAnchors(store: AnchorStore, chain: Anchor['chain'], id: string): { anchors: Anchor[]; forged: number } {
  let text = '';
  try {
    text = fs.readFileSync(store.file, 'utf8');
  } catch {
    return { anchors: [], forged: 0 };
  }
  const anchors: Anchor[] = [];
  let forged = 0;
  for (const line of text.split('\n')) {
    if (!line.includes(id)) continue;
    try {
      const { mac, ...a } = JSON.parse(line) as Anchor & { mac: string };
      if (a.chain !== chain || a.id !== id) continue;
      if (mac !== macOf(store.key, a)) forged++;
      else anchors.push(a);
    } catch {
      forged++;
    }
  }
  return { anchors, forged };
}
