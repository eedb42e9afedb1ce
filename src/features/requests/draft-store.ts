// Unsent request forms kept on this device, so nothing typed is lost when the network drops, the
// tab closes or the battery dies. Web: localStorage. Elsewhere (no storage package in this app
// yet): kept in memory for the life of the app.
import type { RequestFormValues } from './forms';

export interface StoredDraft {
  values: RequestFormValues;
  /** The request version the edits started from (null for a request not yet created). */
  baseVersion: number | null;
  /** When it was written here (ms since epoch). */
  savedAt: number;
}

const PREFIX = 'toolgate.request-draft.v1';
const memory = new Map<string, string>();

interface KeyValue {
  getItem(k: string): string | null;
  setItem(k: string, v: string): void;
  removeItem(k: string): void;
}

function storage(): KeyValue {
  try {
    const ls = (globalThis as { localStorage?: KeyValue }).localStorage;
    if (ls) return ls;
  } catch {
    // Storage refused (private mode): fall back to memory.
  }
  return memoryStorage;
}

const memoryStorage: KeyValue = { getItem: (k) => memory.get(k) ?? null, setItem: (k, v) => void memory.set(k, v), removeItem: (k) => void memory.delete(k) };

/** One slot per user and request ("new" for the request being written). */
export const draftKey = (userId: string, requestKey: string) => `${PREFIX}.${userId}.${requestKey}`;

function looksLikeDraft(v: unknown): v is StoredDraft {
  if (!v || typeof v !== 'object') return false;
  const d = v as Partial<StoredDraft>;
  return !!d.values && typeof d.values === 'object' && Array.isArray(d.values.items) && typeof d.savedAt === 'number';
}

export function loadDraft(userId: string, requestKey: string): StoredDraft | null {
  try {
    const key = draftKey(userId, requestKey);
    const raw = memory.get(key) ?? storage().getItem(key);
    if (!raw) return null;
    const parsed: unknown = JSON.parse(raw);
    return looksLikeDraft(parsed) ? parsed : null;
  } catch {
    return null;
  }
}

/** False when the device refused to keep it (storage full or blocked). */
export function saveDraft(userId: string, requestKey: string, draft: StoredDraft): boolean {
  const s = storage();
  const text = JSON.stringify(draft);
  try {
    s.setItem(draftKey(userId, requestKey), text);
    if (s !== memoryStorage) memory.delete(draftKey(userId, requestKey));
    return true;
  } catch {
    memory.set(draftKey(userId, requestKey), text);
    return false;
  }
}

export function clearDraft(userId: string, requestKey: string): void {
  memory.delete(draftKey(userId, requestKey));
  try {
    storage().removeItem(draftKey(userId, requestKey));
  } catch {
    // nothing kept
  }
}
