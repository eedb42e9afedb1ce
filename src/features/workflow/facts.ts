// The facts of a request that decide what a signer is told and asked for, taken from the request
// detail the same way the server takes them (shared/domain/lifecycle), so the meaning shown before
// signing is the meaning the record will keep.
import { meaningOf, needsFor, targetsOf, type RequestAction, type RequestFacts, type RequestState } from '@shared/domain/lifecycle';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { ActionNeeds } from '@shared/schemas/sign-offs';
import type { Role } from '@shared/schemas/users';

export const productTitle = (p: { sku: string; name: string }) => `${p.sku} ${p.name}`;

export function factsOf(r: RequestDetail): RequestFacts {
  return {
    toolCode: r.tool.code,
    irreversible: r.impact.irreversible,
    removesSteel: r.impact.removesSteel,
    endedProducts: r.impact.endedProducts.map((p) => ({ id: p.id, title: productTitle(p) })),
    retestRequired: r.retestRequired,
  };
}

/** The meaning of the signature in words, before signing (null for withdraw, which signs nothing). */
export function meaningFor(r: RequestDetail, action: RequestAction, role: Role | undefined, target?: RequestState): string | null {
  if (action === 'approve' && r.workflow?.guard?.approvalMeaning) return r.workflow.guard.approvalMeaning;
  return meaningOf(action, factsOf(r), { role, target });
}

/** What the caller must provide for an action: the server's answer, else the shared table's. */
export function needsOf(r: RequestDetail, action: RequestAction): ActionNeeds {
  const sent = r.workflow?.needs[action];
  if (sent) return sent;
  const targets = targetsOf(action);
  return { ...needsFor(action, factsOf(r)), cutReport: action === 'record_cut', targets: targets.length > 1 ? [...targets] : [] };
}
