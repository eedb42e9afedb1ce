import { z } from 'zod';
import { uploadWithProgress } from '@/api/upload';

// A stand-in XMLHttpRequest that records what was sent and lets the test answer.
class FakeXhr {
  static last: FakeXhr;
  method = '';
  url = '';
  withCredentials = false;
  headers: Record<string, string> = {};
  body: unknown;
  status = 0;
  responseText = '';
  upload: { onprogress?: (e: { lengthComputable: boolean; loaded: number; total: number }) => void } = {};
  onload?: () => void;
  onerror?: () => void;
  onabort?: () => void;
  ontimeout?: () => void;
  constructor() {
    FakeXhr.last = this;
  }
  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  setRequestHeader(k: string, v: string) {
    this.headers[k] = v;
  }
  send(body: unknown) {
    this.body = body;
  }
  abort() {
    this.onabort?.();
  }
  answer(status: number, body: unknown) {
    this.status = status;
    this.responseText = JSON.stringify(body);
    this.onload?.();
  }
}

const attachment = z.object({ id: z.string(), size: z.number() });

describe('uploadWithProgress', () => {
  const real = global.XMLHttpRequest;
  beforeEach(() => {
    global.XMLHttpRequest = FakeXhr as unknown as typeof XMLHttpRequest;
  });
  afterEach(() => {
    global.XMLHttpRequest = real;
  });

  it('when bytes go out, then progress is reported and the answer is parsed with the schema', async () => {
    const progress: number[] = [];
    const done = uploadWithProgress('/api/things/1/files', attachment, {
      file: new Blob(['abc'], { type: 'image/png' }),
      fileName: 'front.png',
      fields: { kind: 'before' },
      onProgress: (p) => progress.push(p),
    });
    const xhr = FakeXhr.last;
    expect(xhr.method).toBe('POST');
    expect(xhr.withCredentials).toBe(true);
    const form = xhr.body as FormData;
    expect(form.get('kind')).toBe('before');
    expect((form.get('file') as File).name).toBe('front.png');
    xhr.upload.onprogress?.({ lengthComputable: true, loaded: 50, total: 200 });
    xhr.answer(201, { id: 'f1', size: 3 });
    await expect(done).resolves.toEqual({ id: 'f1', size: 3 });
    expect(progress).toEqual([0.25, 1]);
  });

  it('when the server refuses the file, then an ApiError with its code and words', async () => {
    const done = uploadWithProgress('/api/x', attachment, { file: new Blob(['abc']) });
    FakeXhr.last.answer(413, { error: { code: 'payload_too_large', message: 'The file is too large.' } });
    await expect(done).rejects.toMatchObject({ status: 413, code: 'payload_too_large', message: 'The file is too large.' });
  });

  it('when the connection drops, then code network', async () => {
    const done = uploadWithProgress('/api/x', attachment, { file: new Blob(['abc']) });
    FakeXhr.last.onerror?.();
    await expect(done).rejects.toMatchObject({ code: 'network' });
  });

  it('when the caller aborts, then the upload stops with an AbortError', async () => {
    const ctl = new AbortController();
    const done = uploadWithProgress('/api/x', attachment, { file: new Blob(['abc']), signal: ctl.signal });
    ctl.abort();
    await expect(done).rejects.toMatchObject({ name: 'AbortError' });
  });
});
