import { roleLabels, type Role } from '../schemas/users';
import type { GateId } from './gates';

// The change-request lifecycle (DESIGN section 4), as ONE table used by the client and the server.
//
//   draft --submit--> engineering_review --sign_review--> brand_approval --approve--> cut_authorized
//   cut_authorized --record_cut--> samples_review --accept_samples (designer AND engineer)--> closed
//   engineering_review --return_to_draft--> draft
//   brand_approval --return--> engineering_review | draft          brand_approval --decline--> declined
//   samples_review --rework--> cut_authorized
//   cut_authorized --confirm_receipt (the factory's toolmaker; state unchanged)--> cut_authorized, before record_cut
//   draft | engineering_review | brand_approval --withdraw (submitter or admin)--> withdrawn
//
// Every action except withdraw is a signature: it is recorded as a sign-off with its meaning in words.
// The administrator may withdraw a request but never signs on anyone's behalf.

export const requestStates = [
  'draft',
  'engineering_review',
  'brand_approval',
  'cut_authorized',
  'samples_review',
  'closed',
  'declined',
  'withdrawn',
] as const;
export type RequestState = (typeof requestStates)[number];

export const requestActions = [
  'submit',
  'sign_review',
  'return_to_draft',
  'approve',
  'return',
  'decline',
  'confirm_receipt',
  'record_cut',
  'accept_samples',
  'rework',
  'withdraw',
] as const;
export type RequestAction = (typeof requestActions)[number];

/** Icon names from MaterialCommunityIcons (@expo/vector-icons); a state is never shown by colour alone. */
export type LifecycleIcon =
  | 'pencil-outline'
  | 'clipboard-search-outline'
  | 'account-tie-outline'
  | 'content-cut'
  | 'eye-check-outline'
  | 'check-circle-outline'
  | 'close-octagon-outline'
  | 'archive-arrow-down-outline'
  | 'send-outline'
  | 'file-sign'
  | 'arrow-u-left-top'
  | 'check-decagram-outline'
  | 'wrench-outline';

/** How a state reads at a glance; the app maps tones to the palette (DESIGN section 9). */
export type StateTone = 'working' | 'waiting' | 'go' | 'done' | 'stopped';

/**
 * any:                    every user of the role
 * submitter:              only the designer who wrote the request (ctx.isSubmitter)
 * own_brand:              a member of the request's brand (ctx.isOwnBrand)
 * submitter_or_own_brand: the submitter or a member of the request's brand
 * own_factory:            a toolmaker of the factory where the tool sits (ctx.isOwnFactory)
 */
export type ActorScope = 'any' | 'submitter' | 'own_brand' | 'submitter_or_own_brand' | 'own_factory';

/** The roles whose acceptance of first samples closes a request. */
export const acceptanceRoles = ['designer', 'engineer'] as const;
export type AcceptanceRole = (typeof acceptanceRoles)[number];

/** What a sign-off records as the decision. */
export type SignOffDecision =
  | 'submitted'
  | 'reviewed'
  | 'returned'
  | 'approved'
  | 'declined'
  | 'received'
  | 'cut_recorded'
  | 'accepted'
  | 'rework'
  | 'withdrawn';

export type Need = 'never' | 'always' | 'when_irreversible' | 'when_flagged';

export interface ActionNeeds {
  comment: 'required' | 'optional';
  /** Re-enter the password (a second signing component, 21 CFR 11.200(a) as a model). */
  password: Need;
  /** Tick every product the change ends. */
  tickEndedProducts: Need;
  /** Type the tool code. */
  typeToolCode: Need;
  /** A note on the safety re-test (DESIGN section 6). */
  retestNote: Need;
}

/**
 * The meaning of the signature in words. Placeholders: {toolCode}, {products} ("product X" or
 * "products X and Y"), {steelWork} ("removing steel from" or "welding and re-cutting"), {target}.
 */
export interface MeaningTemplates {
  text: string;
  /** Used when the change cannot be undone and ends at least one product. */
  irreversible?: string;
  /** Used when the change cannot be undone but ends no product. */
  irreversibleNoneEnded?: string;
  /** Per-role wording, where roles sign for different things. */
  byRole?: Partial<Record<Role, string>>;
}

export interface StateRule {
  label: string;
  description: string;
  icon: LifecycleIcon;
  tone: StateTone;
  terminal: boolean;
}

export interface ActionRule {
  label: string;
  icon: LifecycleIcon;
  from: readonly RequestState[];
  /** Possible targets; the first is the default. More than one means the signer picks (`target`). */
  to: readonly RequestState[];
  /** The roles that may take the action, each with the scope it needs. */
  who: Partial<Record<Role, ActorScope>>;
  signature: boolean;
  decision: SignOffDecision;
  meaning: MeaningTemplates | null;
  needs: ActionNeeds;
  /** True for the step the state waits for (inbox, e-mail); false for an optional step (withdraw). */
  awaited: boolean;
  /** accept_samples: each acceptance role signs once; the state moves when all have signed. */
  collectsAcceptance?: boolean;
  /** rework: forget earlier acceptances of the samples. */
  clearsAcceptances?: boolean;
  /** confirm_receipt: the factory's receipt of the cut sheet, once per release to the factory. */
  receipt?: boolean;
  /** record_cut: refused until the factory has confirmed receipt of the cut sheet. */
  needsReceipt?: boolean;
  /** What must be on the request before the action may be taken (gates.ts). */
  gate?: GateId;
}

const optional = (over: Partial<ActionNeeds> = {}): ActionNeeds => ({
  comment: 'optional',
  password: 'never',
  tickEndedProducts: 'never',
  typeToolCode: 'never',
  retestNote: 'never',
  ...over,
});

/** The whole lifecycle: states and actions. */
export const lifecycle: { states: Record<RequestState, StateRule>; actions: Record<RequestAction, ActionRule> } = {
  states: {
    draft: {
      label: 'Being written',
      description: 'The designer is preparing the request: images, cut items and the product it is for.',
      icon: 'pencil-outline',
      tone: 'working',
      terminal: false,
    },
    engineering_review: {
      label: 'With engineering',
      description: 'The tooling engineer is classifying, pricing and checking every cut item.',
      icon: 'clipboard-search-outline',
      tone: 'waiting',
      terminal: false,
    },
    brand_approval: {
      label: 'Awaiting brand sign-off',
      description: 'The brand lead decides whether the tool may be changed.',
      icon: 'account-tie-outline',
      tone: 'waiting',
      terminal: false,
    },
    cut_authorized: {
      label: 'Cleared to cut',
      description: 'The factory may change the tool as the signed change notice describes.',
      icon: 'content-cut',
      tone: 'go',
      terminal: false,
    },
    samples_review: {
      label: 'First samples in review',
      description: 'The designer and the tooling engineer check the first samples from the changed tool.',
      icon: 'eye-check-outline',
      tone: 'waiting',
      terminal: false,
    },
    closed: {
      label: 'Done',
      description: 'Samples accepted; the tool is at its new revision.',
      icon: 'check-circle-outline',
      tone: 'done',
      terminal: true,
    },
    declined: {
      label: 'Turned down',
      description: 'The brand lead declined the change; the tool stays as it is.',
      icon: 'close-octagon-outline',
      tone: 'stopped',
      terminal: true,
    },
    withdrawn: {
      label: 'Withdrawn',
      description: 'Taken back before the cut was cleared; the tool stays as it is.',
      icon: 'archive-arrow-down-outline',
      tone: 'stopped',
      terminal: true,
    },
  },
  actions: {
    submit: {
      label: 'Sign and submit',
      icon: 'send-outline',
      from: ['draft'],
      to: ['engineering_review'],
      who: { designer: 'submitter' },
      signature: true,
      decision: 'submitted',
      meaning: { text: 'I submit this change to tool {toolCode} as my design intent and ask for engineering review.' },
      needs: optional(),
      awaited: true,
    },
    sign_review: {
      label: 'Sign engineering review',
      icon: 'file-sign',
      from: ['engineering_review'],
      to: ['brand_approval'],
      who: { engineer: 'any' },
      signature: true,
      decision: 'reviewed',
      meaning: {
        text: 'I have reviewed every cut item for tool {toolCode}: the change can be undone and ends no product.',
        irreversible:
          'I have reviewed every cut item for tool {toolCode}: the change cannot be undone, and {products} can no longer be made from it.',
        irreversibleNoneEnded:
          'I have reviewed every cut item for tool {toolCode}: the change cannot be undone, and no product in line or planned needs the parts it changes.',
      },
      needs: optional(),
      awaited: true,
      gate: 'review_ready',
    },
    return_to_draft: {
      label: 'Return to designer',
      icon: 'arrow-u-left-top',
      from: ['engineering_review'],
      to: ['draft'],
      who: { engineer: 'any' },
      signature: true,
      decision: 'returned',
      meaning: { text: 'I return this change to tool {toolCode} to the designer for changes.' },
      needs: optional({ comment: 'required' }),
      awaited: true,
    },
    approve: {
      label: 'Approve the change',
      icon: 'check-decagram-outline',
      from: ['brand_approval'],
      to: ['cut_authorized'],
      who: { brand_lead: 'own_brand' },
      signature: true,
      decision: 'approved',
      meaning: {
        text: 'I approve the change to tool {toolCode}; it is made on a replacement insert, the current insert is kept, and no product is ended.',
        irreversible: 'I approve {steelWork} tool {toolCode}; {products} can no longer be made from it.',
        irreversibleNoneEnded:
          'I approve {steelWork} tool {toolCode}, which cannot be undone; no product in line or planned needs the parts it changes.',
      },
      needs: optional({ password: 'when_irreversible', tickEndedProducts: 'when_irreversible', typeToolCode: 'when_irreversible' }),
      awaited: true,
      gate: 'approval_ready',
    },
    return: {
      label: 'Send back',
      icon: 'arrow-u-left-top',
      from: ['brand_approval'],
      to: ['engineering_review', 'draft'],
      who: { brand_lead: 'own_brand' },
      signature: true,
      decision: 'returned',
      meaning: { text: 'I send this change to tool {toolCode} back to {target} for changes.' },
      needs: optional({ comment: 'required' }),
      awaited: true,
    },
    decline: {
      label: 'Decline',
      icon: 'close-octagon-outline',
      from: ['brand_approval'],
      to: ['declined'],
      who: { brand_lead: 'own_brand' },
      signature: true,
      decision: 'declined',
      meaning: { text: 'I decline this change to tool {toolCode}; the tool stays as it is.' },
      needs: optional({ comment: 'required' }),
      awaited: true,
    },
    confirm_receipt: {
      label: 'Confirm receipt of the cut sheet',
      icon: 'file-sign',
      from: ['cut_authorized'],
      to: ['cut_authorized'],
      who: { toolmaker: 'own_factory' },
      signature: true,
      decision: 'received',
      meaning: { text: 'I confirm that the factory received the signed cut sheet for tool {toolCode} and will cut from it.' },
      needs: optional(),
      awaited: true,
      receipt: true,
    },
    record_cut: {
      label: 'Record the cut as done',
      icon: 'content-cut',
      from: ['cut_authorized'],
      to: ['samples_review'],
      who: { engineer: 'any', toolmaker: 'own_factory' },
      signature: true,
      decision: 'cut_recorded',
      meaning: { text: 'I confirm that tool {toolCode} was changed as the signed change notice describes and is ready for first samples.' },
      needs: optional(),
      awaited: true,
      needsReceipt: true,
    },
    accept_samples: {
      label: 'Accept first samples',
      icon: 'check-circle-outline',
      from: ['samples_review'],
      to: ['closed'],
      who: { designer: 'submitter_or_own_brand', engineer: 'any' },
      signature: true,
      decision: 'accepted',
      meaning: {
        text: 'I accept the first samples from tool {toolCode}.',
        byRole: {
          designer: 'I accept the first samples from tool {toolCode} as matching the design intent.',
          engineer: 'I accept the first samples from tool {toolCode} as matching the signed change notice.',
        },
      },
      needs: optional({ retestNote: 'when_flagged' }),
      awaited: true,
      collectsAcceptance: true,
    },
    rework: {
      label: 'Send back for rework',
      icon: 'wrench-outline',
      from: ['samples_review'],
      to: ['cut_authorized'],
      who: { designer: 'submitter_or_own_brand', engineer: 'any' },
      signature: true,
      decision: 'rework',
      meaning: { text: 'I send tool {toolCode} back for rework: the first samples do not match the signed change notice.' },
      needs: optional({ comment: 'required' }),
      awaited: false,
      clearsAcceptances: true,
    },
    withdraw: {
      label: 'Withdraw request',
      icon: 'archive-arrow-down-outline',
      from: ['draft', 'engineering_review', 'brand_approval'],
      to: ['withdrawn'],
      who: { designer: 'submitter', admin: 'any' },
      signature: false,
      decision: 'withdrawn',
      meaning: null,
      needs: optional({ comment: 'required' }),
      awaited: false,
    },
  },
};

/** Facts about the caller and the request that the rules need. */
export interface ActorContext {
  /** The caller wrote (and submits) this request. */
  isSubmitter?: boolean;
  /** The caller belongs to the request's brand (a brand lead approves only for their brands). */
  isOwnBrand?: boolean;
  /** The caller is a toolmaker of the factory where the request's tool sits. */
  isOwnFactory?: boolean;
  /** Roles that have already accepted the first samples in this round. */
  alreadyAccepted?: readonly AcceptanceRole[];
  /** The factory has confirmed receipt of the cut sheet since the brand's approval. */
  receiptConfirmed?: boolean;
}

export type Refusal = { ok: false; code: 'wrong_state' | 'forbidden'; message: string };
export type CanTakeResult = { ok: true } | Refusal;

/** HTTP status for a refusal: 409 for the wrong state (someone else moved it first), 403 for no right. */
export const refusalStatus = (code: Refusal['code']): 403 | 409 => (code === 'forbidden' ? 403 : 409);

export const stateLabel = (s: RequestState): string => lifecycle.states[s].label;

const lower = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);
const orList = (xs: readonly string[]) => (xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} or ${xs[xs.length - 1]}`);

function scopeHolds(scope: ActorScope, ctx: ActorContext): boolean {
  switch (scope) {
    case 'any':
      return true;
    case 'submitter':
      return ctx.isSubmitter === true;
    case 'own_brand':
      return ctx.isOwnBrand === true;
    case 'submitter_or_own_brand':
      return ctx.isSubmitter === true || ctx.isOwnBrand === true;
    case 'own_factory':
      return ctx.isOwnFactory === true;
  }
}

const scopeWords: Record<ActorScope, (role: Role) => string> = {
  any: (role) => `a ${lower(roleLabels[role])}`,
  submitter: (role) => `the ${lower(roleLabels[role])} who wrote this request`,
  own_brand: (role) => `a ${lower(roleLabels[role])} of this request's brand`,
  submitter_or_own_brand: (role) => `the ${lower(roleLabels[role])} who wrote this request or one of its brand`,
  own_factory: (role) => `a ${lower(roleLabels[role])} of the factory where the tool sits`,
};

/** Who may take an action, in words: "a brand lead of this request's brand". */
export function whoMayTake(action: RequestAction): string {
  const who = lifecycle.actions[action].who;
  return orList((Object.keys(who) as Role[]).map((r) => scopeWords[who[r]!](r)));
}

/**
 * Whether `role` may take `action` on a request in `state`. A role that may never take the action,
 * or lacks the right to this request, is refused 'forbidden' (403) whatever the state; a caller who
 * may take it but not now is refused 'wrong_state' (409).
 */
export function canTake(action: RequestAction, state: RequestState, role: Role, ctx: ActorContext = {}): CanTakeResult {
  const rule = lifecycle.actions[action];
  const scope = rule.who[role];
  const verb = lower(rule.label);
  if (!scope) {
    const why = role === 'admin' && rule.signature ? ' An administrator cannot sign on anyone\'s behalf.' : '';
    return { ok: false, code: 'forbidden', message: `A ${lower(roleLabels[role])} cannot ${verb}: only ${whoMayTake(action)} can.${why}` };
  }
  if (!scopeHolds(scope, ctx)) {
    return { ok: false, code: 'forbidden', message: `Only ${whoMayTake(action)} can ${verb}.` };
  }
  if (!rule.from.includes(state)) {
    return {
      ok: false,
      code: 'wrong_state',
      message: `This request is now "${stateLabel(state)}"; you can ${verb} only while it is ${orList(rule.from.map((s) => `"${stateLabel(s)}"`))}.`,
    };
  }
  if (rule.collectsAcceptance && isAcceptanceRole(role) && (ctx.alreadyAccepted ?? []).includes(role)) {
    return { ok: false, code: 'wrong_state', message: `The first samples were already accepted for the ${lower(roleLabels[role])}.` };
  }
  if (rule.receipt && ctx.receiptConfirmed) {
    return { ok: false, code: 'wrong_state', message: 'The factory has already confirmed receipt of the cut sheet: record the cut when it is done.' };
  }
  return { ok: true };
}

export const isAcceptanceRole = (role: Role): role is AcceptanceRole => (acceptanceRoles as readonly Role[]).includes(role);

/** The actions `role` may take now, in table order. */
export function allowedActions(state: RequestState, role: Role, ctx: ActorContext = {}): RequestAction[] {
  return requestActions.filter((a) => canTake(a, state, role, ctx).ok);
}

/** Raised for a call that breaks the table (a programming error, not a user's). */
export class LifecycleError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LifecycleError';
  }
}

/** The targets a signer may pick for an action (more than one only for return from brand sign-off). */
export const targetsOf = (action: RequestAction): readonly RequestState[] => lifecycle.actions[action].to;

export interface TransitionInput {
  /** Where a return goes; defaults to the first target in the table. */
  target?: RequestState;
  /** Needed for accept_samples: who accepts. */
  role?: Role;
  alreadyAccepted?: readonly AcceptanceRole[];
}

/** The acceptances of first samples after the action (rework clears them; acceptance adds one). */
export function acceptancesAfter(action: RequestAction, input: TransitionInput): AcceptanceRole[] {
  const rule = lifecycle.actions[action];
  const before = [...new Set(input.alreadyAccepted ?? [])];
  if (rule.clearsAcceptances) return [];
  if (!rule.collectsAcceptance) return before;
  if (!input.role || !isAcceptanceRole(input.role)) throw new LifecycleError(`${action} needs the accepting role (designer or engineer)`);
  return acceptanceRoles.filter((r) => r === input.role || before.includes(r));
}

/**
 * The state after `action` on a request in `state`. Call `canTake` first for the user's error;
 * this throws LifecycleError for a state or target the table does not allow.
 */
export function nextState(action: RequestAction, state: RequestState, input: TransitionInput = {}): RequestState {
  const rule = lifecycle.actions[action];
  if (!rule.from.includes(state)) throw new LifecycleError(`${action} is not possible from ${state}`);
  if (input.target !== undefined && !rule.to.includes(input.target)) {
    throw new LifecycleError(`${action} can go to ${rule.to.join(' or ')}, not ${input.target}`);
  }
  if (rule.collectsAcceptance) {
    const after = acceptancesAfter(action, input);
    return acceptanceRoles.every((r) => after.includes(r)) ? rule.to[0] : state;
  }
  return input.target ?? rule.to[0];
}

export interface NextActor {
  role: Role;
  scope: ActorScope;
  actions: RequestAction[];
}

/**
 * Who must act on a request in `state` (inbox and e-mail routing): the roles of the awaited actions,
 * with their scope. In first-sample review, a role that has already accepted is no longer waited for.
 */
export function whoActsNext(state: RequestState, ctx: Pick<ActorContext, 'alreadyAccepted'> = {}): NextActor[] {
  const out: NextActor[] = [];
  for (const action of requestActions) {
    const rule = lifecycle.actions[action];
    if (!rule.awaited || !rule.from.includes(state)) continue;
    for (const role of Object.keys(rule.who) as Role[]) {
      if (rule.collectsAcceptance && isAcceptanceRole(role) && (ctx.alreadyAccepted ?? []).includes(role)) continue;
      const scope = rule.who[role]!;
      const found = out.find((n) => n.role === role && n.scope === scope);
      if (found) found.actions.push(action);
      else out.push({ role, scope, actions: [action] });
    }
  }
  return out;
}

export interface ResolvedNeeds {
  comment: boolean;
  password: boolean;
  tickEndedProducts: boolean;
  typeToolCode: boolean;
  retestNote: boolean;
}

/** Facts about the request that decide what a signer must provide. */
export interface RequestFacts {
  toolCode: string;
  /** Any item changes the steel for good. */
  irreversible: boolean;
  /** Any item takes steel out (otherwise only welding or insert swaps). */
  removesSteel: boolean;
  /** Ids and display names ("SR-1001 Ranger Kite") of the products the change ends. */
  endedProducts: readonly { id: string; title: string }[];
  /** Any item carries a safety flag. */
  retestRequired: boolean;
}

const resolve = (need: Need, facts: RequestFacts): boolean =>
  need === 'always' || (need === 'when_irreversible' && facts.irreversible) || (need === 'when_flagged' && facts.retestRequired);

/** What a signer must provide for this action on this request. */
export function needsFor(action: RequestAction, facts: RequestFacts): ResolvedNeeds {
  const n = lifecycle.actions[action].needs;
  return {
    comment: n.comment === 'required',
    password: resolve(n.password, facts),
    tickEndedProducts: resolve(n.tickEndedProducts, facts) && facts.endedProducts.length > 0,
    typeToolCode: resolve(n.typeToolCode, facts),
    retestNote: resolve(n.retestNote, facts),
  };
}

/** What the signer sent with an action. */
export interface ActionSubmission {
  comment?: string;
  password?: string;
  confirmedProductIds?: readonly string[];
  typedToolCode?: string;
  retestNote?: string;
}

/**
 * Field errors for what is missing (same shape as the API's fieldErrors), or null. The password is
 * only checked for presence here; the server verifies it.
 */
export function checkSubmission(action: RequestAction, sent: ActionSubmission, facts: RequestFacts): Record<string, string[]> | null {
  const need = needsFor(action, facts);
  const errors: Record<string, string[]> = {};
  const blank = (s: string | undefined) => !s || s.trim() === '';
  if (need.comment && blank(sent.comment)) errors.comment = ['Say why, so the next person knows what to change'];
  if (need.password && blank(sent.password)) errors.password = ['Enter your password again to sign a change that cannot be undone'];
  if (need.tickEndedProducts) {
    const ticked = new Set(sent.confirmedProductIds ?? []);
    const missing = facts.endedProducts.filter((p) => !ticked.has(p.id));
    if (missing.length > 0) errors.confirmedProductIds = [`Tick every product this change ends: ${missing.map((p) => p.title).join(', ')}`];
  }
  if (need.typeToolCode && (sent.typedToolCode ?? '').trim().toUpperCase() !== facts.toolCode.trim().toUpperCase()) {
    errors.typedToolCode = [`Type the tool code ${facts.toolCode} to confirm`];
  }
  if (need.retestNote && blank(sent.retestNote)) {
    errors.retestNote = ['This change carries safety flags: say where and how the changed toy was re-tested'];
  }
  return Object.keys(errors).length > 0 ? errors : null;
}

const targetWords: Partial<Record<RequestState, string>> = {
  draft: 'the designer',
  engineering_review: 'the tooling engineer',
};

/**
 * The meaning of the signature in words, as the sign-off records it (null for withdraw, which is
 * not a signature).
 */
export function meaningOf(action: RequestAction, facts: Omit<RequestFacts, 'retestRequired'>, options: { role?: Role; target?: RequestState } = {}): string | null {
  const m = lifecycle.actions[action].meaning;
  if (!m) return null;
  const names = facts.endedProducts.map((p) => p.title);
  let template = (options.role && m.byRole?.[options.role]) || m.text;
  if (facts.irreversible && names.length > 0 && m.irreversible) template = m.irreversible;
  else if (facts.irreversible && names.length === 0 && m.irreversibleNoneEnded) template = m.irreversibleNoneEnded;
  const products =
    names.length === 1 ? `product ${names[0]}` : `products ${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
  const target = options.target ?? lifecycle.actions[action].to[0];
  return template
    .replaceAll('{toolCode}', facts.toolCode)
    .replaceAll('{products}', products)
    .replaceAll('{steelWork}', facts.removesSteel ? 'removing steel from' : 'welding and re-cutting')
    .replaceAll('{target}', targetWords[target] ?? stateLabel(target));
}
