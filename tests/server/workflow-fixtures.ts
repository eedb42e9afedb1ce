// Helpers for the sign-off workflow tests: take an action through the API as a user, and walk a
// fresh request of a scene (request-fixtures.ts) to any state through the real actions.
import { randomUUID } from 'node:crypto';
import type { RequestAction, RequestState } from '../../shared/domain/lifecycle';
import { ChangeItemModel, ChangeRequestModel, SignOffModel } from '../../server/models';
import { PASSWORD, request, type openTestApp } from './helpers';
import { createDraft, insertItem, pngImage, ridgeItem, type Scene } from './request-fixtures';

type App = ReturnType<typeof openTestApp>['app'];
export type SceneUser = Scene['users'][keyof Scene['users']];

export const CUT = {
  actualCostCents: 412_500,
  currency: 'USD',
  cutOn: '2026-11-20',
  note: 'Ridge cut in both head cavities; EDM finish.',
  trialOn: '2026-11-21',
  trialShots: 150,
};

/** A full cut report for the request: the counter after the trial, and every cut item measured within tolerance. */
export async function cutFor(id: string, over: Record<string, unknown> = {}) {
  const r = (await ChangeRequestModel.findByPk(id, { include: [{ association: 'tool', attributes: ['id', 'shotCount'] }] }))!;
  const items = await ChangeItemModel.findAll({ where: { requestId: id }, order: [['position', 'ASC']] });
  return {
    ...CUT,
    shotReading: Number(r.tool!.shotCount) + CUT.trialShots,
    firstArticle: items.map((i) => ({ itemId: i.id, intended: '12.40', tolerance: '0.05', measured: '12.43' })),
    ...over,
  };
}

/** What record_cut needs on the request first: the factory's receipt and a photo of the first samples. */
export async function readyToCut(app: App, s: Scene, id: string) {
  const receipt = await actWith(app)(s.users.toolmaker, id, 'confirm_receipt');
  if (receipt.status !== 201) throw new Error(`confirm_receipt failed: ${receipt.status} ${JSON.stringify(receipt.body)}`);
  await addSamplePhoto(app, s.users.toolmaker, id);
}

export async function addSamplePhoto(app: App, user: SceneUser, id: string) {
  const res = await request(app).post(`/api/requests/${id}/attachments`).set(user.auth).field('kind', 'sample').attach('file', await pngImage(), 'first-shot.png');
  if (res.status !== 201) throw new Error(`sample photo upload failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string };
}

/** An estimate that passes the review's gate (the costs of both ways to keep ended products too). */
export const READY_ESTIMATE = { modificationCostCents: 412_500, leadDays: 21, trialRoundsExpected: 1, newInsertCents: 950_000, duplicateToolCents: 1_400_000 };

/**
 * Fills in, as the engineer and designer would, what the review's gate needs and the request lacks:
 * the estimate, its currency, and why there is no product when none is chosen.
 */
export async function fillForReview(id: string) {
  const r = (await ChangeRequestModel.findByPk(id))!;
  if (r.status !== 'engineering_review') return;
  if (r.estimate === null) r.estimate = { ...READY_ESTIMATE };
  const plan = (r.numbersInputs as { plan?: Record<string, unknown> } | null)?.plan;
  if (!plan?.currency) r.numbersInputs = { ...(r.numbersInputs ?? {}), plan: { ...(plan ?? {}), currency: 'USD' } };
  if (!r.derivativeProductId && !r.noDerivativeReason) r.noDerivativeReason = 'A fix to the figures in line; no new product.';
  if (r.changed()) await r.save();
}

/** What each action needs beyond its name, for a request that passes every check. */
export async function bodyFor(id: string, action: RequestAction, extraIn: Record<string, unknown> = {}) {
  const { skipGateFill: _skip, ...extra } = extraIn;
  const r = (await ChangeRequestModel.findByPk(id, { include: [{ association: 'tool', attributes: ['code'] }] }))!;
  const body: Record<string, unknown> = { action, version: r.version };
  if (['return_to_draft', 'return', 'decline', 'rework', 'withdraw'].includes(action)) body.comment = `Because ${action}`;
  if (action === 'record_cut') body.cut = await cutFor(id);
  if (action === 'approve' && r.irreversible) {
    body.password = PASSWORD;
    body.typedToolCode = r.tool!.code;
    body.confirmedProductIds = [...r.endedProductIds];
  }
  if (action === 'accept_samples' && r.retestRequired) body.retestNote = 'Small-parts cylinder and sharp-edge checks passed at the accredited lab, report 4471.';
  return { ...body, ...extra };
}

export function actWith(app: App) {
  return async function act(user: SceneUser, id: string, action: RequestAction, extra: Record<string, unknown> = {}, key?: string) {
    // The engineer fills in what the review's gate needs first (`skipGateFill: true` sends the
    // action on the request as it is, to test the gate itself).
    if (action === 'sign_review' && user.user.role === 'engineer' && !extra.skipGateFill) await fillForReview(id);
    const req = request(app).post(`/api/requests/${id}/actions`).set(user.auth);
    if (key) req.set('Idempotency-Key', key);
    return req.send(await bodyFor(id, action, extra));
  };
}

/** The actions (and who takes them) that lead from a draft to each state. */
export function pathTo(s: Scene, state: RequestState): [SceneUser, RequestAction][] {
  const { designer, engineer, lead } = s.users;
  const toApproval: [SceneUser, RequestAction][] = [
    [designer, 'submit'],
    [engineer, 'sign_review'],
  ];
  switch (state) {
    case 'draft':
      return [];
    case 'engineering_review':
      return [[designer, 'submit']];
    case 'brand_approval':
      return toApproval;
    case 'cut_authorized':
      return [...toApproval, [lead, 'approve']];
    case 'samples_review':
      return [...toApproval, [lead, 'approve'], [engineer, 'record_cut']];
    case 'closed':
      return [...toApproval, [lead, 'approve'], [engineer, 'record_cut'], [designer, 'accept_samples'], [engineer, 'accept_samples']];
    case 'declined':
      return [...toApproval, [lead, 'decline']];
    case 'withdrawn':
      return [[designer, 'withdraw']];
  }
}

/**
 * A fresh request of the scene in `state`, reached through the API. `kind`: 'insert' (a replacement
 * insert: can be undone, ends nothing) or 'ridge' (steel cut from the head: cannot be undone).
 */
export async function requestIn(app: App, s: Scene, state: RequestState, kind: 'insert' | 'ridge' = 'insert', body: Record<string, unknown> = {}) {
  const item = kind === 'insert' ? insertItem(s.visor.id) : ridgeItem(s.head.id);
  const d = await createDraft(app, s, { items: [item], ...body });
  const act = actWith(app);
  for (const [user, action] of pathTo(s, state)) {
    if (action === 'record_cut') await readyToCut(app, s, d.id);
    const res = await act(user, d.id, action);
    if (res.status !== 201) throw new Error(`${action} failed on the way to ${state}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return d.id;
}

export const signOffCount = (requestId: string) => SignOffModel.count({ where: { requestId } });
export const key = () => randomUUID();
