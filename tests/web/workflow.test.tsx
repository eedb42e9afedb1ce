import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { safetyReview } from '@shared/domain/safety';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { Me } from '@shared/schemas/users';
import { sessionKeys } from '@/api/auth';
import { requestKeys } from '@/api/requests';
import { currentOf, isMovedOn, newIdempotencyKey, takeRequestAction } from '@/api/workflow';
import { ApiError } from '@/api/errors';
import { ActionForm } from '@/features/workflow/components/action-form';
import { dueWords, formatInZone, formatUtc, todayIn, usableZone } from '@/lib/requests/workflow-format';

// ---------------------------------------------------------------------------------------------
// Times in the viewer's zone. The offsets are those of the IANA time zone database (tzdata):
// America/Los_Angeles is UTC-8 (PST) in December, Asia/Shanghai UTC+8 all year.

describe('workflow times', () => {
  it('when a UTC sign-off time is shown to a viewer in Los Angeles, then it reads in PST and the UTC time is kept beside it', () => {
    expect(formatInZone('2026-12-01T23:32:31.120Z', 'America/Los_Angeles')).toBe('1 Dec 2026, 15:32 PST');
    expect(formatUtc('2026-12-01T23:32:31.120Z')).toBe('2026-12-01 23:32:31 UTC');
  });

  it('when the same instant is shown in Shanghai, then the calendar day moves on (UTC+8)', () => {
    expect(formatInZone('2026-12-01T23:32:31.120Z', 'Asia/Shanghai')).toMatch(/^2 Dec 2026, 07:32 /);
    expect(todayIn('Asia/Shanghai', new Date('2026-12-01T23:32:31Z'))).toBe('2026-12-02');
    expect(todayIn('America/Los_Angeles', new Date('2026-12-01T23:32:31Z'))).toBe('2026-12-01');
  });

  it('when a stored zone name is unknown, then UTC is used instead of failing', () => {
    expect(usableZone('Mars/Olympus_Mons')).toBe('UTC');
    expect(usableZone(undefined)).toBe('UTC');
    expect(formatInZone('2026-12-01T23:32:31Z', 'Mars/Olympus_Mons')).toBe('1 Dec 2026, 23:32 UTC');
  });

  it('when a stage is overdue, then it says by how many whole days, and under a day since when', () => {
    const now = new Date('2026-12-10T12:00:00Z');
    expect(dueWords('2026-12-07T12:00:00Z', now, 'UTC')).toEqual({ text: 'Overdue by 3 days', overdue: true });
    expect(dueWords('2026-12-09T11:00:00Z', now, 'UTC')).toEqual({ text: 'Overdue by 1 day', overdue: true });
    expect(dueWords('2026-12-10T09:30:00Z', now, 'UTC')).toEqual({ text: 'Overdue since 09:30 today', overdue: true });
  });

  it('when a stage is not due yet, then today, tomorrow or the day is named in the viewer zone', () => {
    const now = new Date('2026-12-10T12:00:00Z');
    expect(dueWords('2026-12-10T17:00:00Z', now, 'UTC')).toEqual({ text: 'Due today at 17:00', overdue: false });
    expect(dueWords('2026-12-11T08:00:00Z', now, 'UTC')).toEqual({ text: 'Due tomorrow at 08:00', overdue: false });
    expect(dueWords('2026-12-15T08:00:00Z', now, 'UTC')).toEqual({ text: 'Due 15 Dec', overdue: false });
    expect(dueWords('2027-01-04T08:00:00Z', now, 'UTC')).toEqual({ text: 'Due 4 Jan 2027', overdue: false });
    // 2026-12-11T02:00Z is still the 10th in Los Angeles (18:00 PST).
    expect(dueWords('2026-12-11T02:00:00Z', now, 'America/Los_Angeles')).toEqual({ text: 'Due today at 18:00', overdue: false });
    expect(dueWords(null, now, 'UTC')).toBeNull();
  });
});

// ---------------------------------------------------------------------------------------------
// The request fixtures

const ids = {
  request: '0f2b8a44-6d1e-4c55-9a0e-1d2c3b4a5f60',
  tool: '11111111-1111-4111-8111-111111111111',
  factory: '22222222-2222-4222-8222-222222222222',
  brand: '33333333-3333-4333-8333-333333333333',
  user: '44444444-4444-4444-8444-444444444444',
  designer: '55555555-5555-4555-8555-555555555555',
  product: '66666666-6666-4666-8666-666666666666',
};

function detail(over: Partial<RequestDetail> = {}): RequestDetail {
  const ended = { id: ids.product, sku: 'SR-1001', name: 'Ranger Kite', status: 'reissue_planned' as const, plannedUnits: 40_000 };
  return {
    id: ids.request,
    number: 7,
    ref: 'CR-0007',
    title: 'Raised visor ridge on the Kite head',
    status: 'engineering_review',
    tool: { id: ids.tool, code: 'KB-T-0412', name: 'Kite head', currentRevision: 1, factory: { id: ids.factory, name: 'Harbourline Plastics' }, weightKg: 180 },
    brand: { id: ids.brand, name: 'Starling Rangers' },
    irreversible: true,
    endedProductCount: 1,
    submitter: { id: ids.designer, name: 'Wren Okafor' },
    stageDueAt: null,
    updatedAt: '2026-12-01T10:00:00.000Z',
    version: 4,
    reason: '',
    targetDate: null,
    derivativeProduct: null,
    noDerivativeReason: null,
    items: [],
    movedProductIds: [],
    attachments: [],
    impact: {
      irreversible: true,
      removesSteel: true,
      items: [],
      endedProducts: [ended],
      keptProducts: [],
      unaffectedProducts: [],
      endedPlannedUnits: 40_000,
      waysToKeep: [],
      summary: '',
    } as unknown as RequestDetail['impact'],
    safety: safetyReview([]),
    retestRequired: false,
    retestNote: null,
    createdAt: '2026-11-30T10:00:00.000Z',
    permissions: { canEdit: false, canEditItems: true, editableFields: [], canUpload: false, uploadKinds: [], actions: ['sign_review', 'return_to_draft'] },
    signOffs: [],
    ...over,
  };
}

const me: Me = {
  id: ids.user,
  email: 'engineer@kestrelbay.example',
  name: 'Tomas Ilves',
  role: 'engineer',
  timeZone: 'America/Los_Angeles',
  active: true,
  brandIds: [],
  factoryId: null,
  factoryName: null,
  brandNames: [],
} as unknown as Me;

function answer(status: number, body: unknown) {
  return Promise.resolve({ ok: status >= 200 && status < 300, status, text: () => Promise.resolve(JSON.stringify(body)) });
}

describe('taking an action', () => {
  const realFetch = global.fetch;
  let fetchMock: jest.Mock;
  beforeEach(() => {
    fetchMock = jest.fn();
    global.fetch = fetchMock as unknown as typeof fetch;
  });
  afterEach(() => {
    global.fetch = realFetch;
  });

  it('when an action is sent, then it carries the Idempotency-Key and the version the signer saw', async () => {
    fetchMock.mockReturnValue(answer(409, { error: { code: 'stale_version', message: 'Someone else changed this change request', current: detail({ version: 5 }) } }));
    const key = newIdempotencyKey();
    const e = await takeRequestAction(ids.request, { action: 'sign_review', version: 4 }, key).catch((x: unknown) => x);
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe(`/api/requests/${ids.request}/actions`);
    expect(init.headers['Idempotency-Key']).toBe(key);
    expect(JSON.parse(init.body)).toEqual({ action: 'sign_review', version: 4 });
    // The 409 carries the fresh request, checked against the shared schema.
    expect(isMovedOn(e)).toBe(true);
    expect(currentOf(e)?.version).toBe(5);
  });

  it('when a 409 carries no usable copy, then currentOf gives null rather than a half-read request', () => {
    expect(currentOf(new ApiError(409, 'wrong_state', 'moved', undefined, { current: { id: 'x' } }))).toBeNull();
    expect(isMovedOn(new ApiError(409, 'conflict', 'key used'))).toBe(false);
  });

  it('when keys are made, then each is a version-4 UUID and no two are the same', () => {
    const keys = Array.from({ length: 50 }, newIdempotencyKey);
    for (const k of keys) expect(k).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(new Set(keys).size).toBe(50);
  });
});

describe('ActionForm', () => {
  const realFetch = global.fetch;
  let fetchMock: jest.Mock;
  let qc: QueryClient;
  beforeEach(() => {
    fetchMock = jest.fn();
    global.fetch = fetchMock as unknown as typeof fetch;
    qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });
    qc.setQueryData(sessionKeys.me(), me);
  });
  afterEach(() => {
    global.fetch = realFetch;
  });
  const wrap = (ui: ReactNode) => <QueryClientProvider client={qc}>{ui}</QueryClientProvider>;

  it('when the engineer opens the review, then the meaning in words names the ended product before signing', () => {
    render(wrap(<ActionForm request={detail()} action="sign_review" onDone={jest.fn()} onMovedOn={jest.fn()} onCancel={jest.fn()} />));
    expect(screen.getByTestId('action-sign_review-meaning-text').textContent).toBe(
      '“I have reviewed every cut item for tool KB-T-0412: the change cannot be undone, and product SR-1001 Ranger Kite can no longer be made from it.”',
    );
    expect(screen.getByTestId('action-sign_review-meaning-signer').textContent).toContain('Tomas Ilves, Tooling engineer');
  });

  it('when a return has no reason, then nothing is sent and the reason field says why', () => {
    render(wrap(<ActionForm request={detail()} action="return_to_draft" onDone={jest.fn()} onMovedOn={jest.fn()} onCancel={jest.fn()} />));
    fireEvent.click(screen.getByTestId('action-return_to_draft-confirm'));
    expect(screen.getByTestId('action-return_to_draft-comment-error').textContent).toMatch(/Say why/);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when someone acted first, then the fresh copy goes into the cache and the form hands it over', async () => {
    const fresh = detail({ status: 'brand_approval', version: 5, permissions: { ...detail().permissions, canEditItems: false, actions: [] } });
    fetchMock.mockReturnValue(answer(409, { error: { code: 'wrong_state', message: 'This request is now "Awaiting brand sign-off"', current: fresh } }));
    const onMovedOn = jest.fn();
    render(wrap(<ActionForm request={detail()} action="sign_review" onDone={jest.fn()} onMovedOn={onMovedOn} onCancel={jest.fn()} />));
    await act(async () => {
      fireEvent.click(screen.getByTestId('action-sign_review-confirm'));
    });
    await waitFor(() => expect(onMovedOn).toHaveBeenCalled());
    expect(onMovedOn.mock.calls[0][0].status).toBe('brand_approval');
    expect(qc.getQueryData<RequestDetail>(requestKeys.detail(ids.request))?.version).toBe(5);
  });

  it('when the same press is retried after a lost answer, then the same Idempotency-Key is sent again', async () => {
    fetchMock.mockRejectedValueOnce(new TypeError('Failed to fetch')).mockRejectedValueOnce(new TypeError('Failed to fetch'));
    render(wrap(<ActionForm request={detail()} action="sign_review" onDone={jest.fn()} onMovedOn={jest.fn()} onCancel={jest.fn()} />));
    await act(async () => {
      fireEvent.click(screen.getByTestId('action-sign_review-confirm'));
    });
    await waitFor(() => expect(screen.getByTestId('action-sign_review-error')).toBeTruthy());
    await act(async () => {
      fireEvent.click(screen.getByTestId('action-sign_review-confirm'));
    });
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(2));
    const first = fetchMock.mock.calls[0][1].headers['Idempotency-Key'];
    expect(first).toMatch(/^[0-9a-f-]{36}$/);
    expect(fetchMock.mock.calls[1][1].headers['Idempotency-Key']).toBe(first);
  });

  it('when samples carry a safety flag, then the re-test note is asked for with the cautions reminder', () => {
    const flagged = detail({
      status: 'samples_review',
      retestRequired: true,
      safety: safetyReview([{ safetyFlags: ['point_or_edge'] }]),
      permissions: { ...detail().permissions, actions: ['accept_samples', 'rework'] },
    });
    render(wrap(<ActionForm request={flagged} action="accept_samples" onDone={jest.fn()} onMovedOn={jest.fn()} onCancel={jest.fn()} />));
    expect(screen.getByTestId('retest-reminder').textContent).toMatch(/accredited/);
    fireEvent.click(screen.getByTestId('action-accept_samples-confirm'));
    expect(screen.getByTestId('action-accept_samples-retest-error').textContent).toMatch(/re-tested/);
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
