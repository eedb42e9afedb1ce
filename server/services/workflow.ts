// The sign-off workflow (DESIGN section 4): taking an action on a change request, in one
// transaction with the request row locked: the lifecycle's checks, the signer's confirmations, the
// sign-off in the hash chain, the new state and due date, the effects on the tool, the audit event
// and the e-mail to whoever acts next. Also the inbox (what waits for me) and overdue reminders.
import type PgBoss from 'pg-boss';
import { clearThrottle, readThrottle, recordFailure } from './throttles';
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  acceptancesAfter,
  canTake,
  checkSubmission,
  lifecycle,
  meaningOf,
  needsFor,
  nextState,
  requestStates,
  whoActsNext,
  type RequestAction,
  type RequestFacts,
  type RequestState,
} from '../../shared/domain/lifecycle';
import { isOverdue, parseStageDueDays, stageDueAt, stagesWithDueDates, type StageDueDays } from '../../shared/domain/stage-due';
import { requestRef } from '../../shared/schemas/change-requests';
import type { InboxItem, InboxResponse } from '../../shared/schemas/inbox';
import type { TakeActionInput, TakeActionResponse } from '../../shared/schemas/request-actions';
import type { SignOff, VerifyResult } from '../../shared/schemas/sign-offs';
import { roleLabels, type Role } from '../../shared/schemas/users';
import { env } from '../env';
import { enqueueEmail } from '../jobs/outbox';
import type { Actor } from '../lib/auth';
import { canonicalJson, sha256Hex } from '../lib/canonical-json';
import { AppError } from '../lib/errors';
import { verifyPassword } from '../lib/passwords';
import { requestMail, type RequestMailFacts, type RequestMailKind, type TransitionFacts } from '../mail/templates/request-transition';
import {
  BillOfPartsModel,
  BrandModel,
  ChangeRequestModel,
  CompanySettingModel,
  ProductModel,
  SignOffModel,
  ToolModel,
  ToolRevisionModel,
  UserModel,
  type ChangeItemModel,
} from '../models';
import { recordAudit } from './audit';
import { recordCut } from './cut-record';
import { assertGatePassed, loadGateFacts } from './request-gates';
import { staleVersion } from './registry-common';
import { actorContext, visibilitySql } from './request-access';
import { accessFacts, buildDetail, computedFields, findVisibleRequest, impactOf, loadImpactContext, loadItems, toSummary } from './request-views';
import { appendSignOff, loadSignedContent, loadSignOffs, signedContent, toSignOffDto, verifyChain } from './sign-off-chain';
import { acceptedRolesOf, actionLabel, contextAsSigned, factsFromImpact } from './workflow-view';
import { changesHoldingTool } from './tool-changes';

export interface WorkflowDeps {
  sequelize: Sequelize;
  /** The job queue; without it no mail is queued (some tests, the seed). */
  boss?: PgBoss;
}

export interface ActionOptions {
  /** The caller's Idempotency-Key: a retry with the same key returns the first answer. */
  idempotencyKey?: string;
  /** When the action happens (the seed dates its history); now by default. */
  at?: Date;
}

/** Before the brand's approval: the change may still move, so its impact is recomputed at each step. */
const PRE_CUT_STATES: readonly RequestState[] = ['draft', 'engineering_review', 'brand_approval'];

export const STAGE_DUE_SETTING_KEY = 'stage_due_business_days';

export async function stageDueDays(transaction?: Transaction): Promise<StageDueDays> {
  const row = await CompanySettingModel.findByPk(STAGE_DUE_SETTING_KEY, { transaction });
  return parseStageDueDays(row?.value);
}

const invalid = (message: string, fieldErrors: Record<string, string[]>) => new AppError('validation_failed', message, 400, fieldErrors);

/** Stored per signer, so two people's keys never meet. */
export const idempotencyKeyHash = (userId: string, key: string) => sha256Hex(`${userId}\n${key}`);

/** What a retry must repeat: the body of the action, without the signing password. */
export const idempotencyFingerprint = (id: string, input: TakeActionInput) => {
  const { password: _password, ...rest } = input;
  return sha256Hex(canonicalJson({ requestId: id, ...rest }));
};


async function passwordMatches(userId: string, password: string, transaction: Transaction) {
  const user = await UserModel.findByPk(userId, { attributes: ['id', 'passwordHash', 'active'], transaction });
  return !!user && user.active && (await verifyPassword(user.passwordHash, password));
}

// Wrong passwords at signing, per user (in PostgreSQL, so every server counts them): after 5 in 15
// minutes the signer waits, so a session left open cannot be used to guess the signing password.
export const SIGNING_PASSWORD_LIMIT = { failures: 5, windowMs: 15 * 60_000 } as const;

async function checkSigningPassword(actor: Actor, password: string, transaction: Transaction) {
  // Read in the action's transaction (one connection each); a failure is counted outside it,
  // since a refused signature rolls the transaction back.
  const db = UserModel.sequelize!;
  const key = `signing:${actor.id}`;
  const seen = await readThrottle(db, key, SIGNING_PASSWORD_LIMIT.windowMs, transaction);
  if (seen && seen.failures >= SIGNING_PASSWORD_LIMIT.failures) {
    const waitMin = Math.max(1, Math.ceil((seen.windowStartedAt.getTime() + SIGNING_PASSWORD_LIMIT.windowMs - Date.now()) / 60_000));
    throw new AppError('rate_limited', `Nothing was signed: too many wrong passwords. Try again in ${waitMin} minute${waitMin === 1 ? '' : 's'}.`, 429);
  }
  if (await passwordMatches(actor.id, password, transaction)) {
    if (seen) await clearThrottle(db, key, transaction);
    return;
  }
  await recordFailure(db, key, SIGNING_PASSWORD_LIMIT.windowMs);
  throw invalid('Nothing was signed: that is not your password. Enter it again to sign a change that cannot be undone.', {
    password: ['The password is not right'],
  });
}

/** What the audit trail keeps of a request's progress (its content is in the sign-off). */
function progressSnapshot(r: ChangeRequestModel) {
  return {
    status: r.status,
    version: r.version,
    acceptedByRoles: r.acceptedByRoles,
    stageEnteredAt: r.stageEnteredAt?.toISOString() ?? null,
    stageDueAt: r.stageDueAt?.toISOString() ?? null,
    baseRevision: r.baseRevision ?? null,
    irreversible: r.irreversible,
    endedProductIds: r.endedProductIds,
    cutReport: r.cutReport ?? null,
    retestNote: r.retestNote ?? null,
    cutSheetReceivedAt: r.cutSheetReceivedAt?.toISOString() ?? null,
  };
}

function withdrawalText(toolCode: string) {
  return `This change to tool ${toolCode} is withdrawn and will not go ahead; the tool stays as it is. (Recorded, not a signature.)`;
}

function fieldErrorMessage(errors: Record<string, string[]>) {
  const first = Object.values(errors)[0]?.[0];
  return first ? `Nothing was signed. ${first}.`.replace(/\.\.$/, '.') : 'Nothing was signed: check the highlighted fields.';
}

// ---------------------------------------------------------------------------------------------
// Take an action

export async function takeAction(deps: WorkflowDeps, actor: Actor, id: string, input: TakeActionInput, opts: ActionOptions = {}): Promise<TakeActionResponse> {
  return deps.sequelize.transaction((transaction) => applyAction({ ...deps, transaction }, actor, id, input, opts));
}

/** takeAction inside the caller's transaction (the seed runs the history of its requests this way). */
export async function applyAction(
  tx: WorkflowDeps & { transaction: Transaction },
  actor: Actor,
  id: string,
  input: TakeActionInput,
  opts: ActionOptions = {},
): Promise<TakeActionResponse> {
  const { transaction } = tx;
  const at = opts.at ?? new Date();
  // 404 for a request the caller may not see; the row stays locked until the transaction ends.
  const r = await findVisibleRequest(actor, id, { transaction, lock: true });
  const currentDetail = () => buildDetail(actor, r, transaction);

  // A retry of an action already taken answers with the sign-off written the first time.
  const keyHash = opts.idempotencyKey ? idempotencyKeyHash(actor.id, opts.idempotencyKey) : null;
  if (keyHash) {
    const done = await SignOffModel.findOne({ where: { idempotencyKey: keyHash }, transaction });
    if (done) {
      if (done.requestId !== r.id || done.action !== input.action) {
        throw new AppError('conflict', 'This Idempotency-Key was already used for another action. Send a new key for a new action.', 409, {
          idempotencyKey: ['Already used for another action'],
        });
      }
      if (done.idempotencyFingerprint && done.idempotencyFingerprint !== idempotencyFingerprint(id, input)) {
        throw new AppError(
          'idempotency_mismatch',
          'This Idempotency-Key was already used with different details. Nothing was signed: send a new key for changed details.',
          422,
          { idempotencyKey: ['Already used with different details'] },
        );
      }
      const detail = await currentDetail();
      return { request: detail, signOff: toSignOffDto(done, detail.workflow!.currentContentHash), replayed: true };
    }
  }

  const from = r.status;
  const can = canTake(input.action, from, actor.role, actorContext(actor, accessFacts(r)));
  if (!can.ok) {
    if (can.code === 'forbidden') throw new AppError('forbidden', can.message, 403);
    throw new AppError('wrong_state', can.message, 409, undefined, { current: await currentDetail() });
  }
  if (input.version !== r.version) throw staleVersion('change request', await currentDetail());
  const tool = r.tool!;
  if (tool.status === 'disposed') {
    throw new AppError('wrong_state', `Tool ${tool.code} was disposed: its requests stay for reference and nothing more can be signed on them.`, 409);
  }

  // The facts the signer is asked to confirm. Before the approval the impact is recomputed from
  // the registry as it is now, and stored, so the signature covers what the screen showed.
  const items = await loadItems(r.id, transaction);
  const preCut = PRE_CUT_STATES.includes(from);
  const baseContext = await loadImpactContext(r.toolId, transaction);
  const impact = impactOf(preCut ? baseContext : await contextAsSigned(baseContext, r, transaction), items, r.movedProductIds, r.estimate);
  const before = progressSnapshot(r);
  if (preCut) {
    r.set(computedFields(impact, items));
    r.baseRevision = tool.currentRevision;
  }
  const facts = factsFromImpact(tool.code, impact, r.retestRequired);
  const need = needsFor(input.action, facts);
  // The gate of the action (shared/domain/gates.ts): nothing is signed blind.
  if (lifecycle.actions[input.action].gate) assertGatePassed(input.action, (await loadGateFacts(r, items, impact, transaction)).facts);

  const errors: Record<string, string[]> = { ...(checkSubmission(input.action, input, facts) ?? {}) };
  if (input.action === 'submit' && items.length === 0) errors.items = ['Add at least one cut item before you submit'];
  if (need.tickEndedProducts && !errors.confirmedProductIds) {
    const ended = new Set(facts.endedProducts.map((p) => p.id));
    if ((input.confirmedProductIds ?? []).some((pid) => !ended.has(pid))) {
      errors.confirmedProductIds = ['Some ticked products are not ended by this change: reload the request and tick the products it lists'];
    }
  }
  if (Object.keys(errors).length) throw invalid(fieldErrorMessage(errors), errors);
  if (need.password) await checkSigningPassword(actor, input.password ?? '', transaction);
  // Record the cut: receipt first, then the report (server/services/cut-record.ts).
  const cut = lifecycle.actions[input.action].needsReceipt ? await recordCut(transaction, actor, r, items, input.cut, at) : null;

  const accepted = acceptedRolesOf(r);
  const to = nextState(input.action, from, { target: input.target, role: actor.role, alreadyAccepted: accepted });
  const meaning = meaningOf(input.action, facts, { role: actor.role, target: to }) ?? withdrawalText(tool.code);

  // The request moves on.
  r.status = to;
  r.acceptedByRoles = to === 'samples_review' && from !== 'samples_review' ? [] : acceptancesAfter(input.action, { role: actor.role, alreadyAccepted: accepted });
  if (to !== from) {
    r.stageEnteredAt = at;
    r.stageDueAt = stageDueAt(to, at, await stageDueDays(transaction));
  }
  if (cut) r.cutReport = cut;
  if (lifecycle.actions[input.action].receipt) r.cutSheetReceivedAt = at;
  if (input.action === 'accept_samples' && input.retestNote) r.retestNote = input.retestNote;
  const content = signedContent(r, items, tool);
  r.changed('updatedAt', true);
  await r.save({ transaction }); // version + 1 (and "AND version = n" in the UPDATE)

  const details: Record<string, unknown> = {};
  if (input.action === 'return') details.target = to;
  if (input.action === 'accept_samples' && input.retestNote) details.retestNote = input.retestNote;
  if (cut) details.cut = cut;
  if (need.tickEndedProducts) details.confirmedProductIds = [...new Set(input.confirmedProductIds ?? [])].sort();
  const confirmedBy = [...(need.password ? ['password'] : []), ...(need.typeToolCode ? ['tool_code'] : [])];
  if (confirmedBy.length) details.confirmedBy = confirmedBy;
  const rule = lifecycle.actions[input.action];
  const signOff = await appendSignOff(
    transaction,
    r.id,
    {
      action: input.action,
      fromStatus: from,
      toStatus: to,
      role: actor.role,
      userId: actor.id,
      printedName: actor.name,
      decision: rule.decision,
      meaning,
      comment: input.comment ?? '',
      signedAt: at,
      details,
      idempotencyKey: keyHash,
      idempotencyFingerprint: keyHash ? idempotencyFingerprint(id, input) : null,
    },
    content,
  );

  // Effects on the tool: released to the factory, or closed at a new revision.
  if (to === 'cut_authorized' && from === 'brand_approval') await startToolChange(transaction, actor, r, at);
  if (to === 'closed') await closeOnTool(transaction, actor, r, items, at);

  await recordAudit(transaction, actor, `change_request.${input.action}`, 'change_request', r.id, before, {
    ...progressSnapshot(r),
    signOff: { id: signOff.id, seq: signOff.seq, decision: signOff.decision, meaning: signOff.meaning, contentHash: signOff.contentHash, hash: signOff.hash },
  });

  if (tx.boss) {
    await queueRequestMails(tx as Required<WorkflowDeps> & { transaction: Transaction }, r, 'act', facts, {
      actionLabel: rule.label,
      byName: actor.name,
      byRole: roleLabels[actor.role],
      meaning,
      comment: input.comment ?? '',
      at,
      cut,
      record: { seq: signOff.seq, hash: signOff.hash },
    });
  }

  const detail = await buildDetail(actor, await findVisibleRequest(actor, r.id, { transaction }), transaction);
  return { request: detail, signOff: toSignOffDto(signOff, detail.workflow!.currentContentHash), replayed: false };
}

/** Cleared to cut: the tool is being changed until the samples are accepted. */
async function startToolChange(transaction: Transaction, actor: Actor, r: ChangeRequestModel, at: Date) {
  const tool = (await ToolModel.findByPk(r.toolId, { transaction, lock: transaction.LOCK.UPDATE }))!;
  const before = { status: tool.status };
  if (tool.status !== 'in_change') {
    tool.status = 'in_change';
    await tool.save({ transaction });
  }
  await recordAudit(transaction, actor, 'tool.change_cleared', 'tool', tool.id, before, { status: tool.status, changeRequestId: r.id, at: at.toISOString() });
}

/**
 * Closed: the tool goes up one revision made by this request. Products that keep their geometry
 * (moved to the new revision, or needing only parts the change does not end) are re-bound to it;
 * the products the change ends stay bound to the old revision, so they can no longer be made from
 * this tool (shared/domain/makeability.ts).
 */
async function closeOnTool(transaction: Transaction, actor: Actor, r: ChangeRequestModel, items: readonly ChangeItemModel[], at: Date) {
  const tool = (await ToolModel.findByPk(r.toolId, { transaction, lock: transaction.LOCK.UPDATE }))!;
  const oldRevision = tool.currentRevision;
  const newRevision = oldRevision + 1;
  const impact = impactOf(await loadImpactContext(tool.id, transaction), items, r.movedProductIds, r.estimate);
  const ended = impact.endedProducts.map((p) => p.id);
  const rebound = [
    ...impact.keptProducts.map((p) => p.id),
    ...impact.unaffectedProducts.filter((p) => p.reason === 'other_parts' || p.reason === 'reversible_only').map((p) => p.id),
  ].sort();
  const revision = await ToolRevisionModel.create(
    { toolId: tool.id, number: newRevision, madeOn: at.toISOString().slice(0, 10), changeRequestId: r.id, note: r.title },
    { transaction },
  );
  if (rebound.length) {
    await BillOfPartsModel.update({ revision: newRevision }, { where: { toolId: tool.id, revision: oldRevision, productId: rebound }, transaction });
  }
  const before = { currentRevision: oldRevision, status: tool.status };
  tool.currentRevision = newRevision;
  // Another change cleared to cut on the same tool keeps it "being changed".
  tool.status = (await changesHoldingTool(tool.id, transaction, r.id)).length ? 'in_change' : 'active';
  await tool.save({ transaction });
  await recordAudit(transaction, actor, 'tool.revise', 'tool', tool.id, before, {
    currentRevision: newRevision,
    status: tool.status,
    revisionId: revision.id,
    changeRequestId: r.id,
    reboundProductIds: rebound,
    endedProductIds: ended,
  });
}

// ---------------------------------------------------------------------------------------------
// Who acts next, and their mail

interface RecipientGroup {
  role: Role;
  users: UserModel[];
  actions: RequestAction[];
}

/** The active users who must act on the request in its current state, by role, with their actions. */
export async function nextActors(r: ChangeRequestModel, transaction?: Transaction): Promise<RecipientGroup[]> {
  const tool = r.tool ?? (await ToolModel.findByPk(r.toolId, { transaction }))!;
  const groups = new Map<Role, { users: Map<string, UserModel>; actions: Set<RequestAction> }>();
  for (const n of whoActsNext(r.status, { alreadyAccepted: acceptedRolesOf(r) })) {
    const base = { role: n.role, active: true };
    const byBrand = () =>
      UserModel.findAll({
        where: base,
        include: [{ model: BrandModel, as: 'brands', where: { id: tool.brandId }, attributes: [], through: { attributes: [] } }],
        transaction,
      });
    const bySubmitter = () => UserModel.findAll({ where: { ...base, id: r.submitterId }, transaction });
    let users: UserModel[];
    switch (n.scope) {
      case 'any':
        users = await UserModel.findAll({ where: base, transaction });
        break;
      case 'submitter':
        users = await bySubmitter();
        break;
      case 'own_brand':
        users = await byBrand();
        break;
      case 'submitter_or_own_brand':
        users = [...(await bySubmitter()), ...(await byBrand())];
        break;
      case 'own_factory':
        users = await UserModel.findAll({ where: { ...base, factoryId: tool.factoryId }, transaction });
        break;
    }
    const g = groups.get(n.role) ?? { users: new Map(), actions: new Set() };
    for (const u of users) g.users.set(u.id, u);
    n.actions.forEach((a) => g.actions.add(a));
    groups.set(n.role, g);
  }
  return [...groups.entries()]
    .filter(([, g]) => g.users.size > 0)
    .map(([role, g]) => ({ role, users: [...g.users.values()].sort((a, b) => a.email.localeCompare(b.email)), actions: requestActionsIn(g.actions) }));
}

const requestActionsIn = (set: Set<RequestAction>) => (Object.keys(lifecycle.actions) as RequestAction[]).filter((a) => set.has(a));

function mailFacts(r: ChangeRequestModel, tool: ToolModel, endedProducts: readonly string[]): RequestMailFacts {
  return {
    id: r.id,
    ref: requestRef(r.number),
    title: r.title,
    toolCode: tool.code,
    toolName: tool.name,
    status: r.status,
    irreversible: r.irreversible,
    endedProducts: [...endedProducts],
    stageDueAt: r.stageDueAt ?? null,
    link: `${env.PUBLIC_URL.replace(/\/+$/, '')}/requests/${r.id}`,
  };
}

/** Product titles of the stored ended products (for mail outside an action). */
async function endedTitles(r: ChangeRequestModel, transaction?: Transaction) {
  if (!r.endedProductIds.length) return [];
  const rows = await ProductModel.findAll({ where: { id: r.endedProductIds }, attributes: ['sku', 'name'], order: [['sku', 'ASC']], transaction });
  return rows.map((p) => `${p.sku} ${p.name}`);
}

/**
 * Queues the mail about the request's new state, in the caller's transaction: one message per role
 * that must act next (its users in To), and one to the submitter when they are not among them.
 * Returns the number of messages queued.
 */
async function queueRequestMails(
  tx: Required<WorkflowDeps> & { transaction: Transaction },
  r: ChangeRequestModel,
  kind: Exclude<RequestMailKind, 'info'>,
  facts: Pick<RequestFacts, 'endedProducts'> | null,
  transition?: TransitionFacts,
) {
  const { transaction } = tx;
  const tool = (await ToolModel.findByPk(r.toolId, { transaction }))!;
  const request = mailFacts(r, tool, facts ? facts.endedProducts.map((p) => p.title) : await endedTitles(r, transaction));
  const groups = await nextActors(r, transaction);
  const outbox = { sequelize: tx.sequelize, transaction };
  let queued = 0;
  for (const g of groups) {
    const job = requestMail({ to: g.users.map((u) => u.email), kind, request, transition, actions: g.actions.map(actionLabel) });
    // The release to the factory carries the cut sheet, made by the mail worker when it sends.
    if (kind === 'act' && r.status === 'cut_authorized' && g.role === 'toolmaker') job.attachments = [{ kind: 'cut_sheet', requestId: r.id, paper: 'a4' }];
    await enqueueEmail(tx.boss, job, outbox);
    queued += 1;
  }
  if (kind === 'act' && !groups.some((g) => g.users.some((u) => u.id === r.submitterId))) {
    const submitter = await UserModel.findByPk(r.submitterId, { attributes: ['id', 'email', 'active'], transaction });
    if (submitter?.active) {
      await enqueueEmail(tx.boss, requestMail({ to: [submitter.email], kind: 'info', request, transition }), outbox);
      queued += 1;
    }
  }
  return queued;
}

// ---------------------------------------------------------------------------------------------
// Overdue reminders

/**
 * Sends a reminder to whoever must act on each request that is overdue in its stage, at most once
 * a day (UTC) for each time the request entered the stage (recorded in stage_reminders, in the same
 * transaction as the mail jobs). Run periodically (server/jobs/stage-reminders.ts).
 */
export async function runStageReminders(deps: Required<WorkflowDeps>, now: Date = new Date()) {
  const sentOn = now.toISOString().slice(0, 10);
  const due = await ChangeRequestModel.findAll({
    where: { status: [...stagesWithDueDates], stageDueAt: { [Op.lt]: now } },
    attributes: ['id'],
    order: [['stageDueAt', 'ASC']],
  });
  let reminded = 0;
  let messages = 0;
  for (const { id } of due) {
    await deps.sequelize.transaction(async (transaction) => {
      const r = await ChangeRequestModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!r || !(stagesWithDueDates as readonly string[]).includes(r.status) || !isOverdue(r.stageDueAt, now)) return;
      const tool = await ToolModel.findByPk(r.toolId, { attributes: ['id', 'status'], transaction });
      if (!tool || tool.status === 'disposed') return;
      const inserted = await deps.sequelize.query<{ request_id: string }>(
        `INSERT INTO stage_reminders (request_id, stage_entered_at, sent_on, status)
         VALUES (:id, :entered, :sentOn, :status) ON CONFLICT DO NOTHING RETURNING request_id`,
        { replacements: { id: r.id, entered: r.stageEnteredAt, sentOn, status: r.status }, type: QueryTypes.SELECT, transaction },
      );
      if (inserted.length === 0) return; // already reminded today for this stage entry
      const n = await queueRequestMails({ ...deps, transaction }, r, 'reminder', null);
      await deps.sequelize.query('UPDATE stage_reminders SET recipients = :n WHERE request_id = :id AND stage_entered_at = :entered AND sent_on = :sentOn', {
        replacements: { n, id: r.id, entered: r.stageEnteredAt, sentOn },
        transaction,
      });
      reminded += 1;
      messages += n;
    });
  }
  return { reminded, messages };
}

// ---------------------------------------------------------------------------------------------
// Inbox

/** States in which the role is waited for (before looking at each request's scope). */
const statesAwaiting = (role: Role) => requestStates.filter((s) => whoActsNext(s).some((n) => n.role === role));

export async function listInbox(sequelize: Sequelize, actor: Actor, now: Date = new Date()): Promise<InboxResponse> {
  const states = statesAwaiting(actor.role);
  if (!states.length) return { data: [], meta: { total: 0, overdue: 0 } };
  const vis = visibilitySql(actor);
  const rows = await sequelize.query<{ id: string }>(
    `SELECT cr.id FROM change_requests cr JOIN tools t ON t.id = cr.tool_id
     WHERE ${vis.sql} AND cr.status IN (:states) AND t.status <> 'disposed'`,
    { type: QueryTypes.SELECT, replacements: { ...vis.replacements, states } },
  );
  const loaded = rows.length
    ? await ChangeRequestModel.findAll({
        where: { id: rows.map((x) => x.id) },
        include: [
          { association: 'tool', attributes: ['id', 'code', 'name', 'brandId', 'factoryId', 'status'], include: [{ association: 'brand', attributes: ['id', 'code', 'name'] }] },
          { association: 'submitter', attributes: ['id', 'name'] },
        ],
      })
    : [];
  const items: (InboxItem & { dueMs: number; enteredMs: number })[] = [];
  for (const r of loaded) {
    const ctx = actorContext(actor, accessFacts(r));
    const waited = whoActsNext(r.status, { alreadyAccepted: acceptedRolesOf(r) })
      .filter((n) => n.role === actor.role)
      .flatMap((n) => n.actions);
    const mine = requestActionsIn(new Set(waited)).filter((a) => canTake(a, r.status, actor.role, ctx).ok);
    if (!mine.length) continue;
    items.push({
      ...toSummary(r),
      waitingFor: mine,
      stageEnteredAt: r.stageEnteredAt.toISOString(),
      overdue: isOverdue(r.stageDueAt, now),
      dueMs: r.stageDueAt ? r.stageDueAt.getTime() : Number.POSITIVE_INFINITY,
      enteredMs: r.stageEnteredAt.getTime(),
    });
  }
  // Overdue first (the longest overdue first), then the oldest in its stage.
  items.sort((a, b) => Number(b.overdue) - Number(a.overdue) || (a.overdue ? a.dueMs - b.dueMs : 0) || a.enteredMs - b.enteredMs || a.number - b.number);
  const data = items.map(({ dueMs: _d, enteredMs: _e, ...rest }) => rest);
  return { data, meta: { total: data.length, overdue: data.filter((i) => i.overdue).length } };
}

// ---------------------------------------------------------------------------------------------
// The record

export async function listSignOffs(actor: Actor, id: string): Promise<{ data: SignOff[]; meta: { currentContentHash: string; count: number } }> {
  const r = await findVisibleRequest(actor, id);
  const { contentHash } = await loadSignedContent(r);
  const rows = await loadSignOffs(r.id);
  return { data: rows.map((s) => toSignOffDto(s, contentHash)), meta: { currentContentHash: contentHash, count: rows.length } };
}

export async function verifySignOffs(actor: Actor, id: string): Promise<VerifyResult> {
  return verifyChain(await findVisibleRequest(actor, id));
}
