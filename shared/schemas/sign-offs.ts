import { z } from 'zod';
import { requestActions, requestStates } from '../domain/lifecycle';
import { roles } from './users';

// The sign-off record of a change request (timeline, chain check) and the workflow facts the
// request detail carries. Server and app both import it.

const state = z.enum(requestStates);
const action = z.enum(requestActions);
const role = z.enum(roles);

export const signOffDecisions = ['submitted', 'reviewed', 'returned', 'approved', 'declined', 'received', 'cut_recorded', 'accepted', 'rework', 'withdrawn'] as const;

/** One cut item as measured on a molded sample (pass: within intended ± tolerance). */
export const firstArticleResultSchema = z.object({
  itemId: z.uuid(),
  /** 0-based position of the cut item; shown as item position + 1. */
  position: z.number().int(),
  partName: z.string(),
  unit: z.enum(['mm', 'in']),
  intended: z.string(),
  tolerance: z.string(),
  measured: z.string(),
  deviation: z.string(),
  pass: z.boolean(),
});
export type FirstArticleResult = z.infer<typeof firstArticleResultSchema>;

/** The cut as reported (stored on the request and in the sign-off that recorded it). */
export const cutReportSchema = z.object({
  actualCostCents: z.number().int(),
  cutOn: z.string(),
  note: z.string(),
  /** Cuts recorded before the first-article report carry only cost, date and note. */
  currency: z.string().optional(),
  trialOn: z.string().optional(),
  trialShots: z.number().int().optional(),
  shotReading: z.number().int().optional(),
  /** The tool's shot count before this reading. */
  previousShotCount: z.number().int().optional(),
  /** The sample photos on the request when the cut was recorded. */
  photoIds: z.array(z.uuid()).optional(),
  firstArticle: z.array(firstArticleResultSchema).optional(),
  firstArticlePass: z.boolean().optional(),
  recordedBy: z.object({ id: z.uuid(), name: z.string() }),
  /** UTC, ISO 8601. */
  recordedAt: z.string(),
});
export type CutReport = z.infer<typeof cutReportSchema>;

/** One entry of the timeline: a signature, or a withdrawal (isSignature false). */
export const signOffSchema = z.object({
  id: z.uuid(),
  seq: z.number().int(),
  action,
  actionLabel: z.string(),
  decision: z.enum(signOffDecisions),
  /** False only for a withdrawal, which is recorded in the chain but signs nothing. */
  isSignature: z.boolean(),
  fromStatus: state,
  toStatus: state,
  role,
  roleLabel: z.string(),
  signer: z.object({ id: z.uuid(), printedName: z.string() }),
  /** The meaning of the signature in words, as the signer was shown it. */
  meaning: z.string(),
  comment: z.string(),
  /** UTC, ISO 8601 with milliseconds ("2026-12-01T14:03:07.120Z"): show it in the viewer's zone. */
  signedAt: z.string(),
  details: z.object({
    target: state.optional(),
    retestNote: z.string().optional(),
    cut: cutReportSchema.optional(),
    /** The ended products the signer ticked (irreversible approval). */
    confirmedProductIds: z.array(z.uuid()).optional(),
    /** How the signer confirmed beyond the session: the password re-entered and the tool code typed. */
    confirmedBy: z.array(z.enum(['password', 'tool_code'])).optional(),
  }),
  contentHash: z.string(),
  hash: z.string(),
  /** False when the request was edited after this sign-off: it was given for an earlier version. */
  contentMatchesCurrent: z.boolean(),
});
export type SignOff = z.infer<typeof signOffSchema>;

export const signOffListResponseSchema = z.object({
  data: z.array(signOffSchema),
  meta: z.object({ currentContentHash: z.string(), count: z.number().int() }),
});
export type SignOffListResponse = z.infer<typeof signOffListResponseSchema>;

/** GET /api/requests/:id/sign-offs/verify */
export const verifyResultSchema = z.object({
  intact: z.boolean(),
  /** How many sign-offs were checked (all of them when intact). */
  checked: z.number().int(),
  /** The first sign-off whose record does not hold (or the last one, when the request itself no longer matches it). */
  firstBrokenSeq: z.number().int().optional(),
  reason: z.string().optional(),
  /** The hash of the last sign-off (null when there is none). */
  headHash: z.string().nullable(),
  currentContentHash: z.string(),
  /** False when the request's content differs from what the last sign-off was given for. */
  contentMatchesLatest: z.boolean(),
  /** What the check looked at, in words for the screen. */
  covers: z.array(z.string()).optional(),
  /** When the check ran (UTC ISO 8601). */
  checkedAt: z.string().optional(),
});
export type VerifyResult = z.infer<typeof verifyResultSchema>;

/** What a signer must provide for one action on this request (shared/domain/lifecycle needsFor, plus the server's own). */
export const actionNeedsSchema = z.object({
  comment: z.boolean(),
  password: z.boolean(),
  tickEndedProducts: z.boolean(),
  typeToolCode: z.boolean(),
  retestNote: z.boolean(),
  /** record_cut: the cut report (actual cost, date, note). */
  cutReport: z.boolean(),
  /** return: the signer picks engineering_review or draft. */
  targets: z.array(state),
});
export type ActionNeeds = z.infer<typeof actionNeedsSchema>;

export const waitingForSchema = z.object({
  role,
  roleLabel: z.string(),
  scope: z.enum(['any', 'submitter', 'own_brand', 'submitter_or_own_brand', 'own_factory']),
  actions: z.array(action),
  /** "a brand lead of this request's brand" */
  who: z.string(),
});

/** The workflow facts of a request, in its detail (optional there, so older clients keep working). */
export const workflowInfoSchema = z.object({
  /** UTC, ISO 8601. */
  stageEnteredAt: z.string(),
  stageDueAt: z.string().nullable(),
  overdue: z.boolean(),
  /** First-sample acceptances so far in this round. */
  acceptedByRoles: z.array(z.enum(['designer', 'engineer'])),
  /** Who the request waits for now (empty when closed, declined or withdrawn). */
  waitingFor: z.array(waitingForSchema),
  /** For each action in permissions.actions: what the caller must provide. */
  needs: z.partialRecord(action, actionNeedsSchema),
  /** What the irreversible-approval guard shows: the tool code to type and every product to tick. */
  guard: z
    .object({
      toolCode: z.string(),
      removesSteel: z.boolean(),
      endedProducts: z.array(z.object({ id: z.uuid(), sku: z.string(), name: z.string(), title: z.string() })),
      /** The meaning the approval will record, in words. */
      approvalMeaning: z.string(),
    })
    .nullable(),
  cutReport: cutReportSchema.nullable(),
  /** The revision the change is made against. */
  baseRevision: z.number().int(),
  currentContentHash: z.string(),
  /** True when the request was edited after its last sign-off (later stages see that signature as given for an earlier version). */
  changedSinceLastSignOff: z.boolean(),
});
export type WorkflowInfo = z.infer<typeof workflowInfoSchema>;
