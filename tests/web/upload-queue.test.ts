// The image queue of the request screens: one upload at a time, held until a new request exists,
// refusals in words next to the file, retry and cancel.
import { ApiError } from '@/api/errors';
import { uploadRequestAttachment, type AttachmentUpload } from '@/api/requests';
import { resetUploadQueueForTests, uploadErrorWords, uploadQueue } from '@/features/requests/upload-queue';

jest.mock('@/api/requests', () => ({ uploadRequestAttachment: jest.fn() }));
const upload = uploadRequestAttachment as jest.MockedFunction<typeof uploadRequestAttachment>;

interface Call {
  requestId: string;
  u: AttachmentUpload;
  resolve: (v: unknown) => void;
  reject: (e: unknown) => void;
}
let calls: Call[] = [];

const file = (name: string) => ({ file: new Blob([name], { type: 'image/png' }), fileName: name, size: 3, previewUri: null });
const flush = () => new Promise((r) => setTimeout(r, 0));
const statuses = () => uploadQueue.snapshot().map((e) => `${e.fileName}:${e.status}`);

beforeEach(() => {
  resetUploadQueueForTests();
  calls = [];
  upload.mockReset();
  upload.mockImplementation((requestId, u) => new Promise((resolve, reject) => void calls.push({ requestId, u, resolve, reject })) as never);
});

it('when three photos are picked, then they are sent one after another, never two at once', async () => {
  const sent: string[] = [];
  uploadQueue.setOnUploaded((_id, a) => sent.push(a.filename));
  uploadQueue.add('r1', 'before', [file('a.png'), file('b.png'), file('c.png')]);
  await flush();
  expect(calls).toHaveLength(1);
  expect(statuses()).toEqual(['a.png:sending', 'b.png:waiting', 'c.png:waiting']);

  calls[0]!.u.onProgress?.(0.5);
  expect(uploadQueue.snapshot()[0]!.progress).toBe(0.5);
  calls[0]!.resolve({ filename: 'a.png' });
  await flush();
  expect(calls).toHaveLength(2);
  expect(calls[1]!.u.fileName).toBe('b.png');
  expect(calls[1]!.u.kind).toBe('before');
  calls[1]!.resolve({ filename: 'b.png' });
  await flush();
  calls[2]!.resolve({ filename: 'c.png' });
  await flush();
  expect(sent).toEqual(['a.png', 'b.png', 'c.png']);
  expect(uploadQueue.snapshot()).toEqual([]);
});

it('when one photo is refused, then it keeps the words and the next one is still sent', async () => {
  uploadQueue.add('r1', 'after', [file('notes.png'), file('good.png')]);
  await flush();
  calls[0]!.reject(new ApiError(415, 'unsupported_media_type', 'This file is not a JPEG, PNG or WebP picture.'));
  await flush();
  expect(statuses()).toEqual(['notes.png:failed', 'good.png:sending']);
  expect(uploadQueue.snapshot()[0]!.error).toBe('This file is not a JPEG, PNG or WebP picture.');

  calls[1]!.resolve({ filename: 'good.png' });
  await flush();
  uploadQueue.retry(uploadQueue.snapshot()[0]!.key);
  await flush();
  expect(calls).toHaveLength(3);
  expect(statuses()).toEqual(['notes.png:sending']);
});

it('when photos are picked for a request not saved yet, then they wait for its id', async () => {
  uploadQueue.add('new', 'before', [file('front.png')]);
  await flush();
  expect(calls).toHaveLength(0);
  expect(statuses()).toEqual(['front.png:held']);
  uploadQueue.adopt('r9');
  await flush();
  expect(calls).toHaveLength(1);
  expect(calls[0]!.requestId).toBe('r9');
});

it('when a waiting photo is cancelled, then it is never sent', async () => {
  const [, second] = uploadQueue.add('r1', 'before', [file('a.png'), file('b.png')]);
  await flush();
  uploadQueue.remove(second!);
  calls[0]!.resolve({ filename: 'a.png' });
  await flush();
  expect(calls).toHaveLength(1);
  expect(uploadQueue.snapshot()).toEqual([]);
});

it('when there is no connection, then the words say so instead of a code', () => {
  expect(uploadErrorWords(new ApiError(0, 'network', 'x'))).toMatch(/no connection/);
  expect(uploadErrorWords(new ApiError(413, 'payload_too_large', 'The file is larger than 12 MB. Pick a smaller photo.'))).toBe('The file is larger than 12 MB. Pick a smaller photo.');
});
