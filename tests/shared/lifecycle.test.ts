import type { Role } from '../../shared/schemas/users';
import {
  acceptancesAfter,
  allowedActions,
  canTake,
  checkSubmission,
  lifecycle,
  LifecycleError,
  meaningOf,
  needsFor,
  nextState,
  refusalStatus,
  requestActions,
  requestStates,
  whoActsNext,
  type ActorContext,
  type RequestAction,
  type RequestFacts,
  type RequestState,
} from '../../shared/domain/lifecycle';
import { takeActionInput } from '../../shared/schemas/request-actions';

// Expectations written from DESIGN section 2 (roles) and section 4 (lifecycle), independently of
// the table in shared/domain/lifecycle.ts.

type Actor = { role: Role; ctx: ActorContext };
const actors = {
  'designer who wrote it': { role: 'designer', ctx: { isSubmitter: true, isOwnBrand: true } },
  'designer of the same brand': { role: 'designer', ctx: { isOwnBrand: true } },
  'designer of another brand': { role: 'designer', ctx: {} },
  engineer: { role: 'engineer', ctx: {} },
  'brand lead of the brand': { role: 'brand_lead', ctx: { isOwnBrand: true } },
  'brand lead of another brand': { role: 'brand_lead', ctx: {} },
  'toolmaker of the tool factory': { role: 'toolmaker', ctx: { isOwnFactory: true } },
  'toolmaker of another factory': { role: 'toolmaker', ctx: {} },
  admin: { role: 'admin', ctx: {} },
} satisfies Record<string, Actor>;
type ActorName = keyof typeof actors;

const expectedFrom: Record<RequestAction, RequestState[]> = {
  submit: ['draft'],
  sign_review: ['engineering_review'],
  return_to_draft: ['engineering_review'],
  approve: ['brand_approval'],
  return: ['brand_approval'],
  decline: ['brand_approval'],
  confirm_receipt: ['cut_authorized'],
  record_cut: ['cut_authorized'],
  accept_samples: ['samples_review'],
  rework: ['samples_review'],
  withdraw: ['draft', 'engineering_review', 'brand_approval'],
};

const expectedWho: Record<RequestAction, ActorName[]> = {
  submit: ['designer who wrote it'],
  sign_review: ['engineer'],
  return_to_draft: ['engineer'],
  approve: ['brand lead of the brand'],
  return: ['brand lead of the brand'],
  decline: ['brand lead of the brand'],
  confirm_receipt: ['toolmaker of the tool factory'],
  record_cut: ['engineer', 'toolmaker of the tool factory'],
  accept_samples: ['designer who wrote it', 'designer of the same brand', 'engineer'],
  rework: ['designer who wrote it', 'designer of the same brand', 'engineer'],
  withdraw: ['designer who wrote it', 'admin'],
};

const cases: [RequestAction, RequestState, ActorName, 'ok' | 'wrong_state' | 'forbidden'][] = [];
for (const action of requestActions) {
  for (const state of requestStates) {
    for (const name of Object.keys(actors) as ActorName[]) {
      const may = expectedWho[action].includes(name);
      cases.push([action, state, name, !may ? 'forbidden' : expectedFrom[action].includes(state) ? 'ok' : 'wrong_state']);
    }
  }
}

describe('lifecycle: who may take which action in which state', () => {
  it('when the matrix is built, then it covers 11 actions x 8 states x 9 callers', () => {
    expect(cases).toHaveLength(11 * 8 * 9);
  });

  it.each(cases)('when %s is tried in %s by the %s, then %s', (action, state, name, expected) => {
    const { role, ctx } = actors[name];
    const r = canTake(action, state, role, ctx);
    if (expected === 'ok') {
      expect(r).toEqual({ ok: true });
      expect(allowedActions(state, role, ctx)).toContain(action);
    } else {
      expect(r).toMatchObject({ ok: false, code: expected });
      if (!r.ok) expect(r.message.length).toBeGreaterThan(10);
      expect(allowedActions(state, role, ctx)).not.toContain(action);
    }
  });

  it('when an admin tries to sign, then the refusal says an administrator cannot sign on anyone\'s behalf', () => {
    const r = canTake('approve', 'brand_approval', 'admin', { isOwnBrand: true });
    expect(r).toMatchObject({ ok: false, code: 'forbidden' });
    if (!r.ok) expect(r.message).toMatch(/cannot sign on anyone's behalf/);
  });

  it('when a brand lead of another brand tries to approve, then the refusal names the brand rule', () => {
    const r = canTake('approve', 'brand_approval', 'brand_lead', {});
    if (r.ok) throw new Error('expected a refusal');
    expect(r.message).toMatch(/of this request's brand/);
    expect(refusalStatus(r.code)).toBe(403);
  });

  it('when two brand leads approve at once, then the second finds the wrong state (409)', () => {
    const first = canTake('approve', 'brand_approval', 'brand_lead', { isOwnBrand: true });
    expect(first.ok).toBe(true);
    const after = nextState('approve', 'brand_approval');
    const second = canTake('approve', after, 'brand_lead', { isOwnBrand: true });
    if (second.ok) throw new Error('expected a refusal');
    expect(second.code).toBe('wrong_state');
    expect(refusalStatus(second.code)).toBe(409);
    expect(second.message).toContain('Cleared to cut');
  });

  it('when a role has already accepted the samples, then it cannot accept again but the other role can', () => {
    const ctx = { isSubmitter: true, alreadyAccepted: ['designer'] as const };
    expect(canTake('accept_samples', 'samples_review', 'designer', ctx)).toMatchObject({ ok: false, code: 'wrong_state' });
    expect(canTake('accept_samples', 'samples_review', 'engineer', ctx)).toEqual({ ok: true });
  });
});

describe('lifecycle: next state', () => {
  it.each([
    ['submit', 'draft', 'engineering_review'],
    ['sign_review', 'engineering_review', 'brand_approval'],
    ['return_to_draft', 'engineering_review', 'draft'],
    ['approve', 'brand_approval', 'cut_authorized'],
    ['return', 'brand_approval', 'engineering_review'],
    ['decline', 'brand_approval', 'declined'],
    ['record_cut', 'cut_authorized', 'samples_review'],
    ['rework', 'samples_review', 'cut_authorized'],
    ['withdraw', 'draft', 'withdrawn'],
    ['withdraw', 'engineering_review', 'withdrawn'],
    ['withdraw', 'brand_approval', 'withdrawn'],
  ] as [RequestAction, RequestState, RequestState][])('when %s is taken in %s, then the request goes to %s', (action, from, to) => {
    expect(nextState(action, from)).toBe(to);
  });

  it('when the brand lead sends back to the draft, then the request goes to draft; to anything else it is refused', () => {
    expect(nextState('return', 'brand_approval', { target: 'draft' })).toBe('draft');
    expect(nextState('return', 'brand_approval', { target: 'engineering_review' })).toBe('engineering_review');
    expect(() => nextState('return', 'brand_approval', { target: 'closed' })).toThrow(LifecycleError);
    expect(() => nextState('approve', 'brand_approval', { target: 'draft' })).toThrow(LifecycleError);
  });

  it('when only the designer has accepted the samples, then the request stays in review; when the engineer accepts too, it closes', () => {
    expect(nextState('accept_samples', 'samples_review', { role: 'designer' })).toBe('samples_review');
    expect(acceptancesAfter('accept_samples', { role: 'designer' })).toEqual(['designer']);
    expect(nextState('accept_samples', 'samples_review', { role: 'engineer', alreadyAccepted: ['designer'] })).toBe('closed');
    expect(acceptancesAfter('accept_samples', { role: 'engineer', alreadyAccepted: ['designer'] })).toEqual(['designer', 'engineer']);
    expect(nextState('accept_samples', 'samples_review', { role: 'designer', alreadyAccepted: ['engineer'] })).toBe('closed');
  });

  it('when samples go back for rework, then earlier acceptances are forgotten', () => {
    expect(acceptancesAfter('rework', { alreadyAccepted: ['designer'] })).toEqual([]);
    expect(acceptancesAfter('record_cut', { alreadyAccepted: ['designer'] })).toEqual(['designer']);
  });

  it('when an action is asked from a state the table does not allow, then it throws', () => {
    expect(() => nextState('approve', 'draft')).toThrow(LifecycleError);
    expect(() => nextState('accept_samples', 'samples_review', { role: 'toolmaker' })).toThrow(LifecycleError);
  });

  it('when a state is terminal, then no action leaves it and every other state has a way out', () => {
    for (const s of requestStates) {
      const out = requestActions.filter((a) => lifecycle.actions[a].from.includes(s));
      expect(out.length === 0).toBe(lifecycle.states[s].terminal);
    }
  });
});

describe('lifecycle: states, labels and icons', () => {
  it('when states are listed, then each has its own word and an icon, never colour alone', () => {
    const labels = requestStates.map((s) => lifecycle.states[s].label);
    expect(new Set(labels).size).toBe(requestStates.length);
    for (const s of requestStates) expect(lifecycle.states[s].icon).toMatch(/^[a-z]+(-[a-z]+)*$/);
    expect(new Set(requestStates.map((s) => lifecycle.states[s].icon)).size).toBe(requestStates.length);
  });

  it('when an action is a signature, then it has a meaning in words; withdraw is not a signature', () => {
    for (const a of requestActions) {
      const rule = lifecycle.actions[a];
      expect(rule.meaning === null).toBe(!rule.signature);
    }
    expect(lifecycle.actions.withdraw.signature).toBe(false);
  });
});

describe('lifecycle: who acts next', () => {
  it('when a request waits in each state, then the inbox routes it to the right people', () => {
    expect(whoActsNext('draft')).toEqual([{ role: 'designer', scope: 'submitter', actions: ['submit'] }]);
    expect(whoActsNext('engineering_review')).toEqual([{ role: 'engineer', scope: 'any', actions: ['sign_review', 'return_to_draft'] }]);
    expect(whoActsNext('brand_approval')).toEqual([{ role: 'brand_lead', scope: 'own_brand', actions: ['approve', 'return', 'decline'] }]);
    expect(whoActsNext('cut_authorized')).toEqual([
      { role: 'toolmaker', scope: 'own_factory', actions: ['confirm_receipt', 'record_cut'] },
      { role: 'engineer', scope: 'any', actions: ['record_cut'] },
    ]);
    expect(whoActsNext('samples_review').map((n) => n.role)).toEqual(['designer', 'engineer']);
    expect(whoActsNext('samples_review', { alreadyAccepted: ['engineer'] })).toEqual([
      { role: 'designer', scope: 'submitter_or_own_brand', actions: ['accept_samples'] },
    ]);
    for (const s of ['closed', 'declined', 'withdrawn'] as const) expect(whoActsNext(s)).toEqual([]);
  });
});

const irreversibleFacts: RequestFacts = {
  toolCode: 'KB-T-0412',
  irreversible: true,
  removesSteel: true,
  endedProducts: [
    { id: 'a1b2c3d4-0000-4000-8000-000000000001', title: 'SR-1001 Ranger Kite' },
    { id: 'a1b2c3d4-0000-4000-8000-000000000002', title: 'SR-1002 Ranger Kite Deluxe' },
  ],
  retestRequired: false,
};
const reversibleFacts: RequestFacts = { ...irreversibleFacts, irreversible: false, removesSteel: false, endedProducts: [] };

describe('lifecycle: what a signer must provide', () => {
  it('when the change cannot be undone, then approval needs the password, every ended product ticked and the tool code typed', () => {
    expect(needsFor('approve', irreversibleFacts)).toEqual({
      comment: false,
      password: true,
      tickEndedProducts: true,
      typeToolCode: true,
      retestNote: false,
    });
    expect(needsFor('approve', reversibleFacts)).toEqual({
      comment: false,
      password: false,
      tickEndedProducts: false,
      typeToolCode: false,
      retestNote: false,
    });
  });

  it('when an irreversible approval misses a tick, the password or the tool code, then each field gets an error', () => {
    const errors = checkSubmission('approve', { confirmedProductIds: [irreversibleFacts.endedProducts[0]!.id], typedToolCode: 'KB-T-0413' }, irreversibleFacts);
    expect(Object.keys(errors ?? {}).sort()).toEqual(['confirmedProductIds', 'password', 'typedToolCode']);
    expect(errors?.confirmedProductIds?.[0]).toContain('SR-1002 Ranger Kite Deluxe');
    const ok = checkSubmission(
      'approve',
      { password: 'secret-pass', confirmedProductIds: irreversibleFacts.endedProducts.map((p) => p.id), typedToolCode: ' kb-t-0412 ' },
      irreversibleFacts,
    );
    expect(ok).toBeNull();
  });

  it('when a return, decline, rework or withdraw has no comment, then the comment is required', () => {
    for (const a of ['return_to_draft', 'return', 'decline', 'rework', 'withdraw'] as const) {
      expect(checkSubmission(a, { comment: '  ' }, reversibleFacts)).toEqual({ comment: [expect.any(String)] });
    }
    expect(checkSubmission('submit', {}, reversibleFacts)).toBeNull();
  });

  it('when the items carry safety flags, then accepting samples needs a re-test note', () => {
    const flagged = { ...reversibleFacts, retestRequired: true };
    expect(checkSubmission('accept_samples', {}, flagged)).toEqual({ retestNote: [expect.stringMatching(/re-tested/)] });
    expect(checkSubmission('accept_samples', { retestNote: 'Small parts and abuse tests passed at the lab, report 2026-114' }, flagged)).toBeNull();
    expect(checkSubmission('accept_samples', {}, reversibleFacts)).toBeNull();
  });
});

describe('lifecycle: meaning of the signature', () => {
  it('when a brand lead approves a cut that ends products, then the meaning names the tool and every product', () => {
    // Wording from DESIGN section 4.
    expect(meaningOf('approve', irreversibleFacts)).toBe(
      'I approve removing steel from tool KB-T-0412; products SR-1001 Ranger Kite and SR-1002 Ranger Kite Deluxe can no longer be made from it.',
    );
    expect(meaningOf('approve', { ...irreversibleFacts, endedProducts: irreversibleFacts.endedProducts.slice(0, 1) })).toBe(
      'I approve removing steel from tool KB-T-0412; product SR-1001 Ranger Kite can no longer be made from it.',
    );
  });

  it('when the change only welds or ends nothing or swaps an insert, then the meaning says so', () => {
    expect(meaningOf('approve', { ...irreversibleFacts, removesSteel: false })).toMatch(/^I approve welding and re-cutting tool KB-T-0412;/);
    expect(meaningOf('approve', { ...irreversibleFacts, endedProducts: [] })).toMatch(/cannot be undone; no product/);
    expect(meaningOf('approve', reversibleFacts)).toMatch(/current insert is kept, and no product is ended/);
  });

  it('when the designer and the engineer accept samples, then each signs for their own part; a return names where it goes', () => {
    expect(meaningOf('accept_samples', reversibleFacts, { role: 'designer' })).toMatch(/design intent/);
    expect(meaningOf('accept_samples', reversibleFacts, { role: 'engineer' })).toMatch(/signed change notice/);
    expect(meaningOf('return', reversibleFacts, { target: 'draft' })).toBe('I send this change to tool KB-T-0412 back to the designer for changes.');
    expect(meaningOf('return', reversibleFacts)).toBe('I send this change to tool KB-T-0412 back to the tooling engineer for changes.');
    expect(meaningOf('withdraw', reversibleFacts)).toBeNull();
  });
});

describe('take-action input', () => {
  it('when a target is sent with an action other than return, then it is refused', () => {
    expect(takeActionInput.safeParse({ action: 'return', version: 3, target: 'draft', comment: 'Needs a softer ridge' }).success).toBe(true);
    expect(takeActionInput.safeParse({ action: 'approve', version: 3, target: 'draft' }).success).toBe(false);
    expect(takeActionInput.safeParse({ action: 'approve' }).success).toBe(false);
  });
});
