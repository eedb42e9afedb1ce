import { z } from 'zod';
import { apiRequest } from '@/api/client';
import { ApiError, applyServerErrors, firstMessages, isApiError } from '@/api/errors';
import { shouldRetry } from '@/api/query-client';

const thing = z.object({ id: z.string(), n: z.number() });

function answer(status: number, body: unknown) {
  const text = typeof body === 'string' ? body : JSON.stringify(body);
  // jsdom has no Response: the client only reads ok, status and text().
  return Promise.resolve({ ok: status >= 200 && status < 300, status, text: () => Promise.resolve(status === 204 ? '' : text) });
}

describe('apiRequest', () => {
  const realFetch = global.fetch;
  let fetchMock: jest.Mock;
  beforeEach(() => {
    fetchMock = jest.fn();
    global.fetch = fetchMock as unknown as typeof fetch;
  });
  afterEach(() => {
    global.fetch = realFetch;
  });

  it('when the answer matches the schema, then it returns the parsed body and sent the cookie and JSON', async () => {
    fetchMock.mockReturnValue(answer(200, { id: 'a', n: 1, extra: true }));
    await expect(apiRequest('/api/things/a', thing, { method: 'PATCH', body: { n: 1 } })).resolves.toEqual({ id: 'a', n: 1 });
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/things/a');
    expect(init).toMatchObject({ method: 'PATCH', credentials: 'include', body: '{"n":1}' });
    expect(init.headers['Content-Type']).toBe('application/json');
  });

  it('when query values are given, then empty ones are left out and the rest encoded', async () => {
    fetchMock.mockReturnValue(answer(200, { id: 'a', n: 1 }));
    await apiRequest('/api/users', thing, { query: { search: 'wren o', role: undefined, x: '' } });
    expect(fetchMock.mock.calls[0][0]).toBe('/api/users?search=wren%20o');
  });

  it('when the server answers 400 with field errors, then an ApiError carries status, code, message and fields', async () => {
    fetchMock.mockReturnValue(
      answer(400, { error: { code: 'validation_failed', message: 'Check the highlighted fields', fieldErrors: { email: ['Enter a valid e-mail address'] } } }),
    );
    const e = await apiRequest('/api/users', thing, { body: {} }).catch((x: unknown) => x);
    expect(isApiError(e)).toBe(true);
    expect(e).toMatchObject({ status: 400, code: 'validation_failed', message: 'Check the highlighted fields', fieldErrors: { email: ['Enter a valid e-mail address'] } });
  });

  it('when the server answers 401, then the error says so in the server words', async () => {
    fetchMock.mockReturnValue(answer(401, { error: { code: 'unauthorized', message: 'Wrong e-mail or password' } }));
    await expect(apiRequest('/api/auth/sign-in', thing, { body: {} })).rejects.toMatchObject({ status: 401, code: 'unauthorized', message: 'Wrong e-mail or password' });
  });

  it('when a success body does not match the schema, then code bad_data', async () => {
    fetchMock.mockReturnValue(answer(200, { id: 'a', n: 'one' }));
    await expect(apiRequest('/api/things/a', thing)).rejects.toMatchObject({ code: 'bad_data', status: 200 });
  });

  it('when a success body is not JSON, then code bad_data', async () => {
    fetchMock.mockReturnValue(answer(200, '<html>proxy</html>'));
    await expect(apiRequest('/api/things/a', thing)).rejects.toMatchObject({ code: 'bad_data' });
  });

  it('when a 502 comes back as HTML, then a plain "not answering" error with status 502', async () => {
    fetchMock.mockReturnValue(answer(502, '<html>Bad gateway</html>'));
    await expect(apiRequest('/api/things/a', thing)).rejects.toMatchObject({ status: 502, code: 'unavailable' });
  });

  it('when the network is down, then code network with a clear message', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    await expect(apiRequest('/api/things/a', thing)).rejects.toMatchObject({ status: 0, code: 'network', message: expect.stringContaining('Cannot reach Toolgate') });
  });

  it('when the call is aborted, then the abort passes through untouched', async () => {
    const abort = new Error('aborted');
    abort.name = 'AbortError';
    fetchMock.mockRejectedValue(abort);
    await expect(apiRequest('/api/things/a', thing)).rejects.toBe(abort);
  });

  it('when the schema is null (204), then it resolves to undefined', async () => {
    fetchMock.mockReturnValue(answer(204, ''));
    await expect(apiRequest('/api/auth/sign-out', null, { method: 'POST' })).resolves.toBeUndefined();
  });
});

describe('error helpers', () => {
  it('when field errors have nested keys, then the first message of each top field is kept', () => {
    expect(firstMessages({ 'brandIds.0': ['Unknown brand'], email: ['Already in use', 'second'] })).toEqual({ brandIds: 'Unknown brand', email: 'Already in use' });
  });

  it('when a server error names only known fields, then they go on the fields and no form message', () => {
    const setErrors = jest.fn();
    const setStatus = jest.fn();
    applyServerErrors(new ApiError(409, 'conflict', 'A user with that e-mail already exists', { email: ['Already in use'] }), ['email', 'name'], { setErrors, setStatus });
    expect(setErrors).toHaveBeenCalledWith({ email: 'Already in use' });
    expect(setStatus).toHaveBeenCalledWith(undefined);
  });

  it('when a server error has no field errors, then its message becomes the form message', () => {
    const setErrors = jest.fn();
    const setStatus = jest.fn();
    applyServerErrors(new ApiError(429, 'rate_limited', 'Too many sign-in attempts.'), ['email'], { setErrors, setStatus });
    expect(setErrors).not.toHaveBeenCalled();
    expect(setStatus).toHaveBeenCalledWith('Too many sign-in attempts.');
  });

  it('when a field error names a field the form lacks, then the message also shows at form level', () => {
    const setErrors = jest.fn();
    const setStatus = jest.fn();
    applyServerErrors(new ApiError(400, 'validation_failed', 'This invitation link is not valid', { token: ['Invalid'] }), ['password'], { setErrors, setStatus });
    expect(setStatus).toHaveBeenCalledWith('This invitation link is not valid');
  });

  it('when deciding retries, then 4xx never retry and network errors retry twice', () => {
    expect(shouldRetry(0, new ApiError(404, 'not_found', 'x'))).toBe(false);
    expect(shouldRetry(0, new ApiError(0, 'network', 'x'))).toBe(true);
    expect(shouldRetry(2, new ApiError(503, 'unavailable', 'x'))).toBe(false);
  });
});
