// The tamper-evident sign-off record of a change request.
//
// Each sign-off keeps the request's signed content at that moment (`content`) and its SHA-256
// (`content_hash`, over the canonical JSON of the content), so a signature is bound to exactly what
// was signed. Each sign-off's `hash` is HMAC-SHA256, keyed with RECORD_CHAIN_KEY (a setting the
// database never holds), over prev_hash + canonical JSON of its own fields + content_hash, with
// prev_hash the previous sign-off's hash (64 zeros for the first): changing, removing or
// re-ordering any row breaks every hash after it, and without the key nobody can recompute them.
// Every new head is also anchored outside the database (record-anchor.ts, and the transition
// e-mail), so dropping the last sign-offs is found too. `verifyChain` recomputes all of it, checks
// each signer could sign that step then (membership_history), and checks the request itself
// against the chain where the lifecycle allows no edits.
import type { Transaction } from 'sequelize';
import { lifecycle, type RequestAction, type RequestState, type SignOffDecision } from '../../shared/domain/lifecycle';
import type { SignOff, VerifyResult } from '../../shared/schemas/sign-offs';
import { roleLabels, type Role } from '../../shared/schemas/users';
import { createHmac } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { canTake } from '../../shared/domain/lifecycle';
import { env } from '../env';
import { canonicalJson, sha256Hex } from '../lib/canonical-json';
import { appendAnchor, readAnchors, type AnchorStore } from '../lib/record-anchor';
import { ChangeItemModel, type ChangeRequestModel, SignOffModel, ToolModel } from '../models';

export const GENESIS_HASH = '0'.repeat(64);

/** States in which the request may still be edited (designer on a draft, engineer in review). */
export const EDITABLE_STATES: readonly RequestState[] = ['draft', 'engineering_review'];

/** What a signature covers: the change itself, not its progress (status, due dates, cut report). */
export interface SignedContent {
  v: 1;
  requestId: string;
  number: number;
  title: string;
  reason: string;
  tool: { id: string; code: string; revision: number };
  derivativeProductId: string | null;
  items: {
    partId: string;
    effect: string;
    method: string;
    size: string;
    unit: string;
    note: string;
    safetyFlags: string[];
    region: unknown;
  }[];
  movedProductIds: string[];
  endedProductIds: string[];
  estimate: unknown;
}

type ItemLike = Pick<ChangeItemModel, 'position' | 'partId' | 'effect' | 'method' | 'size' | 'unit' | 'note' | 'safetyFlags' | 'region'>;

/** The request's signed content from its stored fields, items and tool. */
export function signedContent(
  r: Pick<ChangeRequestModel, 'id' | 'number' | 'title' | 'reason' | 'derivativeProductId' | 'movedProductIds' | 'endedProductIds' | 'estimate' | 'baseRevision'>,
  items: readonly ItemLike[],
  tool: { id: string; code: string; currentRevision: number },
): SignedContent {
  return {
    v: 1,
    requestId: r.id,
    number: r.number,
    title: r.title,
    reason: r.reason,
    tool: { id: tool.id, code: tool.code, revision: r.baseRevision ?? tool.currentRevision },
    derivativeProductId: r.derivativeProductId ?? null,
    items: [...items]
      .sort((a, b) => a.position - b.position)
      .map((i) => ({
        partId: i.partId,
        effect: i.effect,
        method: i.method,
        size: i.size,
        unit: i.unit,
        note: i.note ?? '',
        safetyFlags: [...(i.safetyFlags ?? [])].sort(),
        region: i.region ?? null,
      })),
    movedProductIds: [...r.movedProductIds].sort(),
    endedProductIds: [...r.endedProductIds].sort(),
    estimate: r.estimate ?? null,
  };
}

export const contentHashOf = (content: unknown) => sha256Hex(canonicalJson(content));

/** Loads what signedContent needs and computes it. */
export async function loadSignedContent(r: ChangeRequestModel, transaction?: Transaction) {
  const items = await ChangeItemModel.findAll({ where: { requestId: r.id }, order: [['position', 'ASC']], transaction });
  const tool = r.tool ?? (await ToolModel.findByPk(r.toolId, { transaction }));
  if (!tool) throw new Error(`Tool ${r.toolId} of request ${r.id} is missing`);
  const content = signedContent(r, items, tool);
  return { content, contentHash: contentHashOf(content) };
}

/** The fields of a sign-off that its hash covers (besides prev_hash and content_hash). */
export interface ChainFields {
  requestId: string;
  seq: number;
  action: RequestAction;
  fromStatus: RequestState;
  toStatus: RequestState;
  role: Role;
  userId: string;
  printedName: string;
  decision: SignOffDecision;
  meaning: string;
  comment: string;
  /** UTC ISO 8601 with milliseconds. */
  signedAt: string;
  details: Record<string, unknown>;
}

/** Where chain heads are anchored outside the database, and the key of the chains. */
export const anchorStore = (): AnchorStore => ({ file: env.RECORD_ANCHOR_FILE, key: env.RECORD_CHAIN_KEY });

export const chainHash = (prevHash: string, fields: ChainFields, contentHash: string, key = env.RECORD_CHAIN_KEY) =>
  createHmac('sha256', key).update(prevHash + canonicalJson(fields) + contentHash, 'utf8').digest('hex');

const fieldsOf = (s: SignOffModel): ChainFields => ({
  requestId: s.requestId,
  seq: s.seq,
  action: s.action,
  fromStatus: s.fromStatus,
  toStatus: s.toStatus,
  role: s.role,
  userId: s.userId,
  printedName: s.printedName,
  decision: s.decision,
  meaning: s.meaning,
  comment: s.comment,
  signedAt: s.signedAt.toISOString(),
  details: s.details ?? {},
});

export interface NewSignOff {
  action: RequestAction;
  fromStatus: RequestState;
  toStatus: RequestState;
  role: Role;
  userId: string;
  printedName: string;
  decision: SignOffDecision;
  meaning: string;
  comment: string;
  signedAt: Date;
  details: Record<string, unknown>;
  idempotencyKey: string | null;
  idempotencyFingerprint?: string | null;
}

/**
 * Appends a sign-off to the request's chain. The caller holds the request row lock, so nobody
 * else appends between reading the last sign-off and writing this one.
 */
export async function appendSignOff(transaction: Transaction, requestId: string, s: NewSignOff, content: SignedContent) {
  const last = await SignOffModel.findOne({ where: { requestId }, order: [['seq', 'DESC']], attributes: ['seq', 'hash'], transaction });
  const seq = (last?.seq ?? 0) + 1;
  const prevHash = last?.hash ?? GENESIS_HASH;
  // Milliseconds are what a JS Date and the ISO text hold; PostgreSQL keeps them exactly.
  const signedAt = new Date(Math.floor(s.signedAt.getTime()));
  const contentHash = contentHashOf(content);
  const fields: ChainFields = {
    requestId,
    seq,
    action: s.action,
    fromStatus: s.fromStatus,
    toStatus: s.toStatus,
    role: s.role,
    userId: s.userId,
    printedName: s.printedName,
    decision: s.decision,
    meaning: s.meaning,
    comment: s.comment,
    signedAt: signedAt.toISOString(),
    details: s.details,
  };
  const hash = chainHash(prevHash, fields, contentHash);
  // The new head leaves the database only once it is committed (a rolled-back one never existed).
  // A failed write is reported but cannot undo the committed signature; the anchor then lags.
  transaction.afterCommit(() => {
    try {
      appendAnchor(anchorStore(), { chain: 'sign_offs', id: requestId, seq, hash, at: signedAt.toISOString() });
    } catch (err) {
      console.error('The sign-off chain head could not be written to the record anchor file', err);
    }
  });
  return SignOffModel.create(
    {
      ...fields,
      signedAt,
      contentHash,
      prevHash,
      hash,
      idempotencyKey: s.idempotencyKey,
      idempotencyFingerprint: s.idempotencyFingerprint ?? null,
      content: content as unknown as Record<string, unknown>,
    },
    { transaction },
  );
}

export async function loadSignOffs(requestId: string, transaction?: Transaction) {
  return SignOffModel.findAll({ where: { requestId }, order: [['seq', 'ASC']], transaction });
}

const pickDetails = (d: Record<string, unknown> | null | undefined): SignOff['details'] => {
  const out: SignOff['details'] = {};
  if (!d) return out;
  if (typeof d.target === 'string') out.target = d.target as RequestState;
  if (typeof d.retestNote === 'string') out.retestNote = d.retestNote;
  if (d.cut && typeof d.cut === 'object') out.cut = d.cut as SignOff['details']['cut'];
  if (Array.isArray(d.confirmedProductIds)) out.confirmedProductIds = d.confirmedProductIds as string[];
  if (Array.isArray(d.confirmedBy)) out.confirmedBy = d.confirmedBy as ('password' | 'tool_code')[];
  return out;
};

export function toSignOffDto(s: SignOffModel, currentContentHash: string): SignOff {
  const rule = lifecycle.actions[s.action];
  return {
    id: s.id,
    seq: s.seq,
    action: s.action,
    actionLabel: rule?.label ?? s.action,
    decision: s.decision,
    isSignature: rule?.signature ?? true,
    fromStatus: s.fromStatus,
    toStatus: s.toStatus,
    role: s.role,
    roleLabel: roleLabels[s.role] ?? s.role,
    signer: { id: s.userId, printedName: s.printedName },
    meaning: s.meaning,
    comment: s.comment,
    signedAt: s.signedAt.toISOString(),
    details: pickDetails(s.details),
    contentHash: s.contentHash,
    hash: s.hash,
    contentMatchesCurrent: s.contentHash === currentContentHash,
  };
}

/** The transitions the lifecycle allows, for checking a stored row. */
function transitionAllowed(action: RequestAction, from: RequestState, to: RequestState) {
  const rule = lifecycle.actions[action];
  if (!rule || !rule.from.includes(from)) return false;
  return rule.to.includes(to) || (rule.collectsAcceptance === true && to === from);
}

/** What verifyChain looks at, as the request screen lists it. */
export const CHECK_COVERS = [
  'Each sign-off still matches what was signed, and its sealed fingerprint (made with a key the database does not hold)',
  'The sign-offs are complete and in order, checked against the copy kept outside the database',
  'Each signer held the role and the brand or factory the step needed when they signed',
  'Each step is one the lifecycle allows, and the request is where its sign-offs end',
];

/**
 * Recomputes the chain: for every sign-off its order, its link to the one before, its content hash
 * from the stored content, its own hash, and a lifecycle-allowed transition that starts where the
 * previous one ended. Then the request itself: its state must be where the chain ends, and, in a
 * state where no edits are allowed, its content must be what the last sign-off was given for.
 */
export async function verifyChain(r: ChangeRequestModel, transaction?: Transaction): Promise<VerifyResult> {
  // The anchors first: a head anchored before the rows are read was committed before, so it must
  // be among them (one written meanwhile is not yet seen, never a false alarm).
  const anchored = readAnchors(anchorStore(), 'sign_offs', r.id);
  const rows = await loadSignOffs(r.id, transaction);
  const { contentHash: current } = await loadSignedContent(r, transaction);
  const last = rows[rows.length - 1];
  const base = {
    headHash: last?.hash ?? null,
    currentContentHash: current,
    contentMatchesLatest: last ? last.contentHash === current : true,
    covers: CHECK_COVERS,
    checkedAt: new Date().toISOString(),
  };
  const broken = (i: number, seq: number, reason: string): VerifyResult => ({ ...base, intact: false, checked: i, firstBrokenSeq: seq, reason });

  let prev = GENESIS_HASH;
  let state: RequestState = 'draft';
  for (const [i, s] of rows.entries()) {
    if (s.seq !== i + 1) return broken(i, s.seq, `Sign-off ${i + 1} is missing or out of order (found number ${s.seq}).`);
    if (s.prevHash !== prev) return broken(i, s.seq, `Sign-off ${s.seq} does not link to the one before it.`);
    const content = s.content as unknown as Partial<SignedContent> | null;
    if (!content || content.requestId !== r.id) return broken(i, s.seq, `Sign-off ${s.seq} was given for another request.`);
    if (contentHashOf(s.content) !== s.contentHash) return broken(i, s.seq, `The content kept with sign-off ${s.seq} does not match its hash.`);
    if (chainHash(s.prevHash, fieldsOf(s), s.contentHash) !== s.hash) return broken(i, s.seq, `Sign-off ${s.seq} was changed after it was written: its hash does not match its fields.`);
    if (s.requestId !== r.id) return broken(i, s.seq, `Sign-off ${s.seq} belongs to another request.`);
    if (s.fromStatus !== state || !transitionAllowed(s.action, s.fromStatus, s.toStatus)) {
      return broken(i, s.seq, `Sign-off ${s.seq} records a step the lifecycle does not allow from "${state}".`);
    }
    prev = s.hash;
    state = s.toStatus;
  }
  if (r.status !== state) {
    return broken(rows.length, last?.seq ?? 0, `The request is "${r.status}", but its sign-offs end at "${state}": its state was changed outside the workflow.`);
  }
  if (last && !EDITABLE_STATES.includes(r.status) && last.contentHash !== current) {
    return broken(rows.length, last.seq, `The request was changed after sign-off ${last.seq}, in a state where it may not be edited.`);
  }
  const signer = await firstSignerProblem(r, rows, transaction);
  if (signer) return broken(signer.index, signer.seq, signer.reason);
  const anchorBroken = anchorProblem(anchored, rows);
  if (anchorBroken) return broken(rows.length, anchorBroken.seq, anchorBroken.reason);
  return { ...base, intact: true, checked: rows.length };
}

interface Membership {
  user_id: string;
  role: Role;
  factory_id: string | null;
  brand_ids: string[];
  active: boolean;
  valid_from: Date;
}

/**
 * Each signer, as they were when they signed (membership_history): active, in the role the row
 * names, and with the brand or factory the step needs (a brand lead of this brand, a toolmaker of
 * this tool's factory, the designer who wrote it). A signature older than the user's first known
 * membership (seeded history) is checked against what the account was set up with.
 */
async function firstSignerProblem(r: ChangeRequestModel, rows: readonly SignOffModel[], transaction?: Transaction) {
  if (!rows.length) return null;
  const tool = r.tool ?? (await ToolModel.findByPk(r.toolId, { transaction }));
  const history = await SignOffModel.sequelize!.query<Membership>(
    'SELECT user_id, role, factory_id, brand_ids, active, valid_from FROM membership_history WHERE user_id IN (:ids) ORDER BY valid_from ASC, id ASC',
    { replacements: { ids: [...new Set(rows.map((s) => s.userId))] }, type: QueryTypes.SELECT, transaction },
  );
  for (const [i, s] of rows.entries()) {
    const mine = history.filter((h) => h.user_id === s.userId);
    const held = [...mine].reverse().find((h) => new Date(h.valid_from) <= s.signedAt) ?? asSetUp(mine);
    const who = `Sign-off ${s.seq} (${s.printedName})`;
    if (!held) return { index: i, seq: s.seq, reason: `${who} names a person Toolgate has no record of.` };
    if (!held.active) return { index: i, seq: s.seq, reason: `${who} was given by an account that was not active at the time.` };
    if (held.role !== s.role) return { index: i, seq: s.seq, reason: `${who} says "${roleLabels[s.role] ?? s.role}", but the signer was "${roleLabels[held.role] ?? held.role}" at the time.` };
    const can = canTake(s.action, s.fromStatus, held.role, {
      isSubmitter: s.userId === r.submitterId,
      isOwnBrand: !!tool && (held.brand_ids ?? []).includes(tool.brandId),
      isOwnFactory: !!tool && held.role === 'toolmaker' && held.factory_id === tool.factoryId,
      alreadyAccepted: [],
    });
    if (!can.ok && can.code === 'forbidden') {
      return { index: i, seq: s.seq, reason: `${who} was given by someone who could not sign this step at the time (wrong brand, factory or role).` };
    }
  }
  return null;
}

/** What an account was set up with: its last membership within a minute of its first. */
function asSetUp(mine: readonly Membership[]) {
  if (!mine.length) return undefined;
  const until = new Date(mine[0]!.valid_from).getTime() + 60_000;
  return [...mine].reverse().find((h) => new Date(h.valid_from).getTime() <= until);
}

/** The heads anchored outside the database must all still be in the chain, with their fingerprint. */
function anchorProblem({ anchors, forged }: ReturnType<typeof readAnchors>, rows: readonly SignOffModel[]) {
  if (forged) return { seq: rows.length, reason: 'A line of the record kept outside the database was altered.' };
  const bySeq = new Map(rows.map((s) => [s.seq, s]));
  for (const a of anchors) {
    const row = bySeq.get(a.seq);
    if (!row) return { seq: a.seq, reason: `Sign-off ${a.seq} is recorded outside the database but is missing here: sign-offs were removed.` };
    if (row.hash !== a.hash) return { seq: a.seq, reason: `Sign-off ${a.seq} differs from the fingerprint recorded outside the database: the record was rewritten.` };
  }
  return null;
}
