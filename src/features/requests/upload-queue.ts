// Images waiting to be sent, sent one at a time so ten photos from a phone never freeze the app or
// fight for the connection. The queue lives outside any screen: leaving the form for the request's
// detail does not stop an upload. Photos picked for a request that is not created yet are held
// (status 'held') until the first save gives it an id.
import type { Attachment, AttachmentKind } from '@shared/schemas/change-requests';
import { toUserMessage, isApiError } from '@/api/errors';
import { uploadRequestAttachment } from '@/api/requests';
import type { UploadFile } from '@/api/upload';

export type UploadStatus = 'held' | 'waiting' | 'sending' | 'failed';

export interface QueuedUpload {
  key: string;
  /** The request id, or "new" while the request is not created yet. */
  requestKey: string;
  kind: AttachmentKind;
  itemId: string | null;
  fileName: string;
  size: number | null;
  /** A local address to show the picture before it is sent (blob: on the web). */
  previewUri: string | null;
  width: number | null;
  height: number | null;
  file: UploadFile;
  status: UploadStatus;
  /** 0..1 while sending. */
  progress: number;
  /** The refusal in words, next to the file. */
  error: string | null;
}

export interface PickedFile {
  file: UploadFile;
  fileName: string;
  size: number | null;
  previewUri: string | null;
  width?: number | null;
  height?: number | null;
}

type Listener = () => void;
type Uploaded = (requestId: string, attachment: Attachment) => void;

let entries: readonly QueuedUpload[] = [];
const listeners = new Set<Listener>();
let onUploaded: Uploaded | null = null;
let running = false;
let current: { key: string; abort: AbortController } | null = null;
let seq = 0;

const emit = () => listeners.forEach((l) => l());
const patch = (key: string, change: Partial<QueuedUpload>) => {
  entries = entries.map((e) => (e.key === key ? { ...e, ...change } : e));
  emit();
};

export const NEW_REQUEST = 'new';

export const uploadQueue = {
  subscribe(l: Listener) {
    listeners.add(l);
    return () => void listeners.delete(l);
  },
  snapshot: () => entries,
  /** Called when a file is stored (the screens put it in the cached request). */
  setOnUploaded(fn: Uploaded | null) {
    onUploaded = fn;
  },

  add(requestKey: string, kind: AttachmentKind, files: readonly PickedFile[], itemId: string | null = null) {
    const held = requestKey === NEW_REQUEST;
    const added = files.map<QueuedUpload>((f) => ({
      key: `u${Date.now().toString(36)}-${(seq++).toString(36)}`,
      requestKey,
      kind,
      itemId,
      fileName: f.fileName,
      size: f.size,
      previewUri: f.previewUri,
      width: f.width ?? null,
      height: f.height ?? null,
      file: f.file,
      status: held ? 'held' : 'waiting',
      progress: 0,
      error: null,
    }));
    entries = [...entries, ...added];
    emit();
    void run();
    return added.map((a) => a.key);
  },

  /** The new request now has an id: send what was held for it. */
  adopt(requestId: string) {
    entries = entries.map((e) => (e.requestKey === NEW_REQUEST ? { ...e, requestKey: requestId, status: 'waiting' as const } : e));
    emit();
    void run();
  },

  retry(key: string) {
    patch(key, { status: 'waiting', error: null, progress: 0 });
    void run();
  },

  /** Drops a file from the queue (cancels it if it is being sent). */
  remove(key: string) {
    if (current?.key === key) current.abort.abort();
    const gone = entries.find((e) => e.key === key);
    entries = entries.filter((e) => e.key !== key);
    if (gone?.previewUri?.startsWith('blob:')) revoke(gone.previewUri);
    emit();
  },

  /** Drops everything held or failed for a request (e.g. a new request the designer starts over). */
  clear(requestKey: string) {
    for (const e of entries.filter((x) => x.requestKey === requestKey)) uploadQueue.remove(e.key);
  },
};

function revoke(uri: string) {
  try {
    URL.revokeObjectURL(uri);
  } catch {
    // not a browser
  }
}

/** One upload at a time, in the order picked; a failure stops only that file. */
async function run() {
  if (running) return;
  running = true;
  try {
    for (;;) {
      const next = entries.find((e) => e.status === 'waiting');
      if (!next) break;
      const abort = new AbortController();
      current = { key: next.key, abort };
      patch(next.key, { status: 'sending', progress: 0, error: null });
      let shown = 0;
      try {
        const a = await uploadRequestAttachment(next.requestKey, {
          file: next.file,
          fileName: next.fileName,
          kind: next.kind,
          itemId: next.itemId,
          signal: abort.signal,
          onProgress: (f) => {
            // Re-render at most every 2 %: a phone photo fires many progress events.
            if (f - shown >= 0.02 || f === 1) {
              shown = f;
              patch(next.key, { progress: f });
            }
          },
        });
        onUploaded?.(next.requestKey, a);
        const done = entries.find((e) => e.key === next.key);
        entries = entries.filter((e) => e.key !== next.key);
        if (done?.previewUri?.startsWith('blob:')) revoke(done.previewUri);
        emit();
      } catch (e) {
        if (e instanceof Error && e.name === 'AbortError') continue;
        patch(next.key, { status: 'failed', error: uploadErrorWords(e) });
      } finally {
        current = null;
      }
    }
  } finally {
    running = false;
  }
}

/** The server's refusal in words (415 not a picture, 413 too large, 400 unreadable...). */
export function uploadErrorWords(e: unknown): string {
  if (isApiError(e)) {
    if (e.code === 'network') return 'Not sent: no connection. Try again when you are back online.';
    return e.message;
  }
  return toUserMessage(e);
}

/** For tests: forget everything. */
export function resetUploadQueueForTests() {
  entries = [];
  running = false;
  current = null;
  emit();
}
