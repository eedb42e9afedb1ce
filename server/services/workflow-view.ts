// The workflow facts a request detail carries: the sign-off timeline, its due date, who it waits
// for, what each of the caller's actions needs, and the irreversible-approval guard.
import type { Transaction } from 'sequelize';
import type { ImpactResult } from '../../shared/domain/impact';
import {
  isAcceptanceRole,
  lifecycle,
  meaningOf,
  needsFor,
  targetsOf,
  whoActsNext,
  type AcceptanceRole,
  type ActorScope,
  type RequestAction,
  type RequestFacts,
} from '../../shared/domain/lifecycle';
import { isOverdue } from '../../shared/domain/stage-due';
import type { ImpactContext, ImpactProductDto } from '../../shared/schemas/change-requests';
import type { ActionNeeds, CutReport, SignOff, WorkflowInfo } from '../../shared/schemas/sign-offs';
import { roleLabels, type Role } from '../../shared/schemas/users';
import { ToolRevisionModel, type ChangeItemModel, type ChangeRequestModel, type SignOffModel } from '../models';
import { contentHashOf, signedContent, toSignOffDto } from './sign-off-chain';

/** States after the brand's approval: the change is fixed, and its impact is shown as it was signed. */
export const RELEASED_STATES = ['cut_authorized', 'samples_review', 'closed'] as const;

export const productTitle = (p: { sku: string; name: string }) => `${p.sku} ${p.name}`;

export function factsFromImpact(toolCode: string, impact: ImpactResult<ImpactProductDto>, retestRequired: boolean): RequestFacts {
  return {
    toolCode,
    irreversible: impact.irreversible,
    removesSteel: impact.removesSteel,
    endedProducts: impact.endedProducts.map((p) => ({ id: p.id, title: productTitle(p) })),
    retestRequired,
  };
}

export function actionNeeds(action: RequestAction, facts: RequestFacts): ActionNeeds {
  const targets = targetsOf(action);
  return { ...needsFor(action, facts), cutReport: action === 'record_cut', targets: targets.length > 1 ? [...targets] : [] };
}

const scopeText: Record<ActorScope, (role: string) => string> = {
  any: (role) => `any ${role}`,
  submitter: (role) => `the ${role} who wrote the request`,
  own_brand: (role) => `a ${role} of the request's brand`,
  submitter_or_own_brand: (role) => `the ${role} who wrote the request, or one of its brand`,
  own_factory: (role) => `a ${role} of the factory where the tool sits`,
};

export const acceptedRolesOf = (r: Pick<ChangeRequestModel, 'acceptedByRoles'>): AcceptanceRole[] =>
  (r.acceptedByRoles ?? []).filter((x): x is AcceptanceRole => isAcceptanceRole(x as Role));

export function cutReportOf(v: unknown): CutReport | null {
  if (!v || typeof v !== 'object') return null;
  const c = v as Partial<CutReport>;
  if (typeof c.actualCostCents !== 'number' || typeof c.cutOn !== 'string') return null;
  return {
    actualCostCents: c.actualCostCents,
    cutOn: c.cutOn,
    note: c.note ?? '',
    recordedBy: c.recordedBy ?? { id: '00000000-0000-0000-0000-000000000000', name: '' },
    recordedAt: c.recordedAt ?? '',
    ...(c.currency !== undefined
      ? {
          currency: c.currency,
          trialOn: c.trialOn,
          trialShots: c.trialShots,
          shotReading: c.shotReading,
          previousShotCount: c.previousShotCount,
          photoIds: c.photoIds ?? [],
          firstArticle: c.firstArticle ?? [],
          firstArticlePass: c.firstArticlePass,
        }
      : {}),
  };
}

/**
 * For a request released to the factory, the impact as it was signed: the tool at the revision the
 * change is made against and, once closed, the products this change re-bound to the revision it
 * made counted at that revision again. Otherwise the context as it is.
 */
export async function contextAsSigned(context: ImpactContext, r: ChangeRequestModel, transaction?: Transaction): Promise<ImpactContext> {
  if (!(RELEASED_STATES as readonly string[]).includes(r.status) || r.baseRevision === null || r.baseRevision === undefined) return context;
  const base = r.baseRevision;
  let made: number | null = null;
  if (r.status === 'closed') {
    const rev = await ToolRevisionModel.findOne({ where: { changeRequestId: r.id }, attributes: ['number'], transaction });
    made = rev?.number ?? null;
  }
  return {
    ...context,
    tool: { ...context.tool, currentRevision: base },
    billOfParts: made === null ? context.billOfParts : context.billOfParts.map((l) => (l.revision === made ? { ...l, revision: base } : l)),
  };
}

export interface WorkflowViewInput {
  r: ChangeRequestModel;
  /** The caller's permitted actions. */
  actions: readonly RequestAction[];
  impact: ImpactResult<ImpactProductDto>;
  retestRequired: boolean;
  items: readonly ChangeItemModel[];
  tool: { id: string; code: string; currentRevision: number };
  signOffs: readonly SignOffModel[];
  now?: Date;
}

export function workflowView(v: WorkflowViewInput): { workflow: WorkflowInfo; signOffs: SignOff[] } {
  const { r } = v;
  const content = signedContent(r, v.items, v.tool);
  const currentContentHash = contentHashOf(content);
  const facts = factsFromImpact(v.tool.code, v.impact, v.retestRequired);
  const accepted = acceptedRolesOf(r);
  const needs: WorkflowInfo['needs'] = {};
  for (const a of v.actions) needs[a] = actionNeeds(a, facts);
  const last = v.signOffs[v.signOffs.length - 1];
  const guard =
    r.status === 'brand_approval' && facts.irreversible
      ? {
          toolCode: v.tool.code,
          removesSteel: facts.removesSteel,
          endedProducts: v.impact.endedProducts.map((p) => ({ id: p.id, sku: p.sku, name: p.name, title: productTitle(p) })),
          approvalMeaning: meaningOf('approve', facts) ?? '',
        }
      : null;
  return {
    signOffs: v.signOffs.map((s) => toSignOffDto(s, currentContentHash)),
    workflow: {
      stageEnteredAt: r.stageEnteredAt.toISOString(),
      stageDueAt: r.stageDueAt ? r.stageDueAt.toISOString() : null,
      overdue: isOverdue(r.stageDueAt, v.now ?? new Date()),
      acceptedByRoles: accepted,
      waitingFor: whoActsNext(r.status, { alreadyAccepted: accepted }).map((n) => ({
        role: n.role,
        roleLabel: roleLabels[n.role],
        scope: n.scope,
        actions: n.actions,
        who: scopeText[n.scope](roleLabels[n.role].toLowerCase()),
      })),
      needs,
      guard,
      cutReport: cutReportOf(r.cutReport),
      baseRevision: content.tool.revision,
      currentContentHash,
      changedSinceLastSignOff: last ? last.contentHash !== currentContentHash : false,
    },
  };
}

/** The label of an action, for mail and messages. */
export const actionLabel = (a: RequestAction) => lifecycle.actions[a].label;
