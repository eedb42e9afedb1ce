// Who may see and change a change request. One place for the rules, used by the API (refusals),
// the detail (permissions shown to the app) and the list (the same visibility rule in SQL).
//
// See:   admin, designer, engineer: every request; brand lead: requests on tools of their brands;
//        toolmaker: requests cleared to cut or later, on tools at their own factory.
//        Anything else is 404, as for a request that does not exist, so existence does not leak.
// Edit:  the designer who wrote it, while it is a draft (every field); a tooling engineer during
//        engineering review (cut items, moved products and reason).
// Files: as edit (any kind); from "cleared to cut" through first-sample review, a tooling engineer
//        or a toolmaker of the tool's factory may add sample photos.
import { allowedActions, isAcceptanceRole, stateLabel, type ActorContext, type RequestState } from '../../shared/domain/lifecycle';
import {
  attachmentKinds,
  editableRequestFields,
  type AttachmentKind,
  type EditableRequestField,
  type RequestDetail,
} from '../../shared/schemas/change-requests';
import type { Actor } from '../lib/auth';
import { AppError, forbidden } from '../lib/errors';

/** The states a toolmaker sees: the change was signed and released to the factory. */
export const FACTORY_STATES: readonly RequestState[] = ['cut_authorized', 'samples_review', 'closed'];
/** The states in which sample photos are added. */
export const SAMPLE_STATES: readonly RequestState[] = ['cut_authorized', 'samples_review'];
/** What the tooling engineer may change during engineering review. */
export const ENGINEER_REVIEW_FIELDS: readonly EditableRequestField[] = ['items', 'movedProductIds', 'reason'];

/** The facts about a request the rules need. */
export interface RequestAccessFacts {
  status: RequestState;
  submitterId: string;
  /** The tool's status, when known: a disposed tool's requests are read-only. */
  tool: { brandId: string; factoryId: string; status?: string };
  acceptedByRoles?: readonly string[];
  /** When the factory confirmed receipt of the cut sheet (null: not yet). */
  cutSheetReceivedAt?: Date | null;
}

export function canSeeRequest(actor: Actor, r: RequestAccessFacts): boolean {
  switch (actor.role) {
    case 'admin':
    case 'designer':
    case 'engineer':
      return true;
    case 'brand_lead':
      return actor.brandIds.includes(r.tool.brandId);
    case 'toolmaker':
      return actor.factoryId !== null && actor.factoryId === r.tool.factoryId && FACTORY_STATES.includes(r.status);
    default:
      return false;
  }
}

/** The same rule as canSeeRequest, as SQL over `change_requests cr JOIN tools t`. */
export function visibilitySql(actor: Actor): { sql: string; replacements: Record<string, unknown> } {
  switch (actor.role) {
    case 'admin':
    case 'designer':
    case 'engineer':
      return { sql: 'true', replacements: {} };
    case 'brand_lead':
      return actor.brandIds.length ? { sql: 't.brand_id IN (:visibleBrandIds)', replacements: { visibleBrandIds: actor.brandIds } } : { sql: 'false', replacements: {} };
    case 'toolmaker':
      return actor.factoryId
        ? { sql: 't.factory_id = :visibleFactoryId AND cr.status IN (:factoryStates)', replacements: { visibleFactoryId: actor.factoryId, factoryStates: FACTORY_STATES } }
        : { sql: 'false', replacements: {} };
    default:
      return { sql: 'false', replacements: {} };
  }
}

export const isSubmitter = (actor: Actor, r: RequestAccessFacts) => actor.id === r.submitterId;

/** The facts the lifecycle table needs about the caller and this request. */
export function actorContext(actor: Actor, r: RequestAccessFacts): ActorContext {
  return {
    isSubmitter: isSubmitter(actor, r),
    isOwnBrand: actor.brandIds.includes(r.tool.brandId),
    isOwnFactory: actor.role === 'toolmaker' && actor.factoryId !== null && actor.factoryId === r.tool.factoryId,
    alreadyAccepted: (r.acceptedByRoles ?? []).filter((x): x is 'designer' | 'engineer' => isAcceptanceRole(x as never)),
    receiptConfirmed: !!r.cutSheetReceivedAt,
  };
}

/** The fields the caller may change now (empty when they may not edit). */
export function editableFieldsFor(actor: Actor, r: RequestAccessFacts): EditableRequestField[] {
  if (r.tool.status === 'disposed') return [];
  if (actor.role === 'designer' && isSubmitter(actor, r) && r.status === 'draft') return [...editableRequestFields];
  if (actor.role === 'engineer' && r.status === 'engineering_review') return [...ENGINEER_REVIEW_FIELDS];
  return [];
}

const wrongState = (message: string) => new AppError('wrong_state', message, 409);

/**
 * Why the caller may not edit this (visible) request, or null when they may. No right at all is
 * 403; the right role at the wrong stage is 409 (someone moved the request on).
 */
export function editRefusal(actor: Actor, r: RequestAccessFacts): AppError | null {
  const now = `This request is now "${stateLabel(r.status)}"`;
  if (actor.role === 'designer') {
    if (!isSubmitter(actor, r)) return forbidden('Only the designer who wrote this request can edit it.');
    if (r.status !== 'draft') {
      return wrongState(
        r.status === 'engineering_review'
          ? `${now}: the designer edits a request only as a draft. During engineering review the tooling engineer may change the cut items, or return it to you.`
          : `${now}: the designer edits a request only as a draft.`,
      );
    }
    return null;
  }
  if (actor.role === 'engineer') {
    if (r.status !== 'engineering_review') {
      return wrongState(
        r.status === 'draft'
          ? `${now}: the designer who wrote it edits the draft; the tooling engineer may change the cut items once it is submitted for engineering review.`
          : `${now}: the tooling engineer changes the cut items only during engineering review.`,
      );
    }
    return null;
  }
  return forbidden('Only the designer who wrote a draft, or a tooling engineer during engineering review, can edit a request.');
}

/** The attachment kinds the caller may upload (and delete) now. */
export function uploadKindsFor(actor: Actor, r: RequestAccessFacts): AttachmentKind[] {
  if (r.tool.status === 'disposed') return [];
  if (editableFieldsFor(actor, r).length > 0) return [...attachmentKinds];
  if (SAMPLE_STATES.includes(r.status) && (actor.role === 'engineer' || actorContext(actor, r).isOwnFactory)) return ['sample'];
  return [];
}

/** Why the caller may not add or remove files on this (visible) request now, or null. */
export function uploadRefusal(actor: Actor, r: RequestAccessFacts, kind?: AttachmentKind): AppError | null {
  if (r.tool.status === 'disposed') return wrongState('The tool of this request was disposed: its record stays for reference and can no longer be changed.');
  const kinds = uploadKindsFor(actor, r);
  if (kinds.length > 0) {
    if (kind === undefined || kinds.includes(kind)) return null;
    return new AppError('forbidden', `At this stage only ${kinds.join(', ')} photos can be added or removed.`, 403, {
      kind: [`Only ${kinds.join(', ')} at this stage`],
    });
  }
  const now = `This request is now "${stateLabel(r.status)}"`;
  switch (actor.role) {
    case 'designer':
      if (!isSubmitter(actor, r)) return forbidden('Only the designer who wrote this request can add or remove its images.');
      return wrongState(`${now}: the designer adds or removes images only while it is a draft.`);
    case 'engineer':
      return wrongState(`${now}: images can be added during engineering review, and sample photos from "Cleared to cut" until the samples are accepted.`);
    case 'toolmaker':
      return wrongState(`${now}: sample photos can be added only from "Cleared to cut" until the samples are accepted.`);
    default:
      return forbidden('Only the designer of a draft, a tooling engineer or the factory\'s toolmaker can add or remove images.');
  }
}

export function permissionsFor(actor: Actor, r: RequestAccessFacts): RequestDetail['permissions'] {
  const editableFields = editableFieldsFor(actor, r);
  const uploadKinds = uploadKindsFor(actor, r);
  return {
    canEdit: editableFields.includes('title'),
    canEditItems: editableFields.includes('items'),
    editableFields,
    canUpload: uploadKinds.length > 0,
    uploadKinds,
    // A disposed tool's requests are kept for reference only: nothing more is signed on them.
    actions: r.tool.status === 'disposed' ? [] : allowedActions(r.status, actor.role, actorContext(actor, r)),
  };
}
