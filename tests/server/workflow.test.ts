import type { RequestAction, RequestState } from '../../shared/domain/lifecycle';
import { inboxResponseSchema } from '../../shared/schemas/inbox';
import { takeActionResponseSchema } from '../../shared/schemas/request-actions';
import { requestDetailSchema } from '../../shared/schemas/change-requests';
import { AuditEventModel, BillOfPartsModel, ChangeRequestModel, ToolModel, ToolRevisionModel } from '../../server/models';
import { openTestApp, request } from './helpers';
import { insertItem, makeScene, type Scene } from './request-fixtures';
import { actWith, CUT, cutFor, readyToCut, requestIn, signOffCount, type SceneUser } from './workflow-fixtures';

const t = openTestApp();
afterAll(() => t.close());
const act = actWith(t.app);

type Who = keyof Scene['users'];
const everyone: Who[] = ['designer', 'otherDesigner', 'engineer', 'lead', 'otherLead', 'toolmaker', 'otherToolmaker', 'admin'];

// The expected answers are written out by hand from DESIGN sections 2 and 4 (who may do what, and
// who may see a request at all), not computed from the lifecycle table they check:
//   201 the action is taken; 403 the role or the person may not take it; 404 the request is not
//   visible to them (brand lead of another brand; toolmakers before the cut is cleared or of another
//   factory).
const matrix: { action: RequestAction; from: RequestState; allowed: Who[]; refused: Partial<Record<Who, 403 | 404>> }[] = [
  {
    action: 'submit',
    from: 'draft',
    allowed: ['designer'],
    refused: { otherDesigner: 403, engineer: 403, lead: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'sign_review',
    from: 'engineering_review',
    allowed: ['engineer'],
    refused: { designer: 403, otherDesigner: 403, lead: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'return_to_draft',
    from: 'engineering_review',
    allowed: ['engineer'],
    refused: { designer: 403, otherDesigner: 403, lead: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'approve',
    from: 'brand_approval',
    allowed: ['lead'],
    refused: { designer: 403, otherDesigner: 403, engineer: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'return',
    from: 'brand_approval',
    allowed: ['lead'],
    refused: { designer: 403, otherDesigner: 403, engineer: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'decline',
    from: 'brand_approval',
    allowed: ['lead'],
    refused: { designer: 403, otherDesigner: 403, engineer: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'confirm_receipt',
    from: 'cut_authorized',
    allowed: ['toolmaker'],
    refused: { designer: 403, otherDesigner: 403, engineer: 403, lead: 403, otherLead: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'record_cut',
    from: 'cut_authorized',
    allowed: ['engineer', 'toolmaker'],
    refused: { designer: 403, otherDesigner: 403, lead: 403, otherLead: 404, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'accept_samples',
    from: 'samples_review',
    allowed: ['designer', 'otherDesigner', 'engineer'],
    refused: { lead: 403, otherLead: 404, toolmaker: 403, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'rework',
    from: 'samples_review',
    allowed: ['designer', 'otherDesigner', 'engineer'],
    refused: { lead: 403, otherLead: 404, toolmaker: 403, otherToolmaker: 404, admin: 403 },
  },
  {
    action: 'withdraw',
    from: 'brand_approval',
    allowed: ['designer', 'admin'],
    refused: { otherDesigner: 403, engineer: 403, lead: 403, otherLead: 404, toolmaker: 404, otherToolmaker: 404 },
  },
];

const expectedTo: Record<RequestAction, RequestState> = {
  submit: 'engineering_review',
  sign_review: 'brand_approval',
  return_to_draft: 'draft',
  approve: 'cut_authorized',
  return: 'engineering_review',
  decline: 'declined',
  confirm_receipt: 'cut_authorized',
  record_cut: 'samples_review',
  accept_samples: 'samples_review', // one of the two acceptances
  rework: 'cut_authorized',
  withdraw: 'withdrawn',
};

describe('every transition x every role', () => {
  it('when the matrix is read, then it names every user for every action', () => {
    for (const row of matrix) expect([...row.allowed, ...Object.keys(row.refused)].sort()).toEqual([...everyone].sort());
  });

  for (const row of matrix) {
    it(`${row.action} from ${row.from}: when ${row.allowed.join(' or ')} take it, then it is signed; when anyone else tries, then ${[...new Set(Object.values(row.refused))].join('/')} and nothing is signed`, async () => {
      const s = await makeScene();
      const refusedOn = await requestIn(t.app, s, row.from);
      const before = await signOffCount(refusedOn);
      const version = (await ChangeRequestModel.findByPk(refusedOn))!.version;
      for (const [who, status] of Object.entries(row.refused) as [Who, number][]) {
        const res = await act(s.users[who], refusedOn, row.action);
        expect([who, res.status]).toEqual([who, status]);
        expect(res.body.error.code).toBe(status === 403 ? 'forbidden' : 'not_found');
      }
      expect(await signOffCount(refusedOn)).toBe(before);
      expect((await ChangeRequestModel.findByPk(refusedOn))!).toMatchObject({ status: row.from, version });

      for (const who of row.allowed) {
        const id = await requestIn(t.app, s, row.from);
        if (row.action === 'record_cut') await readyToCut(t.app, s, id);
        const res = await act(s.users[who], id, row.action);
        expect([who, res.status]).toEqual([who, 201]);
        const body = takeActionResponseSchema.parse(res.body);
        expect(body.replayed).toBe(false);
        expect(body.request.status).toBe(expectedTo[row.action]);
        expect(body.signOff).toMatchObject({ action: row.action, role: s.users[who].user.role, signer: { id: s.users[who].user.id, printedName: s.users[who].user.name }, fromStatus: row.from });
        // record_cut: the factory's receipt of the cut sheet is signed first, then the cut itself
        expect(await signOffCount(id)).toBe(before + (row.action === 'record_cut' ? 2 : 1));
      }
    });
  }

  it('when the right role acts on a request in the wrong state, then 409 wrong_state with the current request, and nothing is signed', async () => {
    const s = await makeScene();
    const u = s.users;
    const cases: [SceneUser, RequestAction, RequestState][] = [
      [u.designer, 'submit', 'engineering_review'],
      [u.engineer, 'sign_review', 'draft'],
      [u.engineer, 'return_to_draft', 'brand_approval'],
      [u.lead, 'approve', 'engineering_review'],
      [u.lead, 'return', 'cut_authorized'],
      [u.lead, 'decline', 'draft'],
      [u.engineer, 'record_cut', 'brand_approval'],
      [u.toolmaker, 'record_cut', 'samples_review'],
      [u.engineer, 'accept_samples', 'cut_authorized'],
      [u.designer, 'rework', 'cut_authorized'],
      [u.designer, 'withdraw', 'cut_authorized'],
      [u.admin, 'withdraw', 'declined'],
      [u.designer, 'submit', 'withdrawn'],
      [u.engineer, 'record_cut', 'closed'],
      [u.lead, 'approve', 'declined'],
    ];
    for (const [user, action, state] of cases) {
      const id = await requestIn(t.app, s, state);
      const before = await signOffCount(id);
      const res = await act(user, id, action);
      expect([action, state, res.status, res.body.error?.code]).toEqual([action, state, 409, 'wrong_state']);
      expect(requestDetailSchema.parse(res.body.error.current).status).toBe(state);
      expect(await signOffCount(id)).toBe(before);
    }
  });

  it('when each acceptance role has accepted once, then the same role cannot accept again (409)', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'samples_review');
    expect((await act(s.users.designer, id, 'accept_samples')).status).toBe(201);
    const again = await act(s.users.otherDesigner, id, 'accept_samples');
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already accepted/);
  });

  it('when the version sent is not the current one, then 409 stale_version with the current request', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'engineering_review');
    const res = await act(s.users.engineer, id, 'sign_review', { version: 0 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stale_version');
    expect(res.body.error.current).toMatchObject({ id, status: 'engineering_review', version: expect.any(Number) });
    expect(res.body.error.current.version).not.toBe(0);
  });

  it('when an action is not in the lifecycle or a target is given where none is taken, then 400 with field errors', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'engineering_review');
    const bad = await request(t.app).post(`/api/requests/${id}/actions`).set(s.users.engineer.auth).send({ action: 'stamp', version: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.action).toBeDefined();
    const target = await act(s.users.engineer, id, 'sign_review', { target: 'draft' });
    expect(target.status).toBe(400);
    expect(target.body.error.fieldErrors.target).toBeDefined();
    expect((await request(t.app).post('/api/requests/not-a-uuid/actions').set(s.users.engineer.auth).send({ action: 'submit', version: 0 })).status).toBe(404);
  });
});

describe('what each action needs', () => {
  it('when a return, decline, rework or withdrawal comes without a comment, then 400 on comment and nothing is signed', async () => {
    const s = await makeScene();
    const cases: [SceneUser, RequestAction, RequestState][] = [
      [s.users.engineer, 'return_to_draft', 'engineering_review'],
      [s.users.lead, 'return', 'brand_approval'],
      [s.users.lead, 'decline', 'brand_approval'],
      [s.users.engineer, 'rework', 'samples_review'],
      [s.users.designer, 'withdraw', 'draft'],
    ];
    for (const [user, action, state] of cases) {
      const id = await requestIn(t.app, s, state);
      const before = await signOffCount(id);
      const res = await act(user, id, action, { comment: '  ' });
      expect([action, res.status]).toEqual([action, 400]);
      expect(res.body.error.fieldErrors.comment).toBeDefined();
      expect(await signOffCount(id)).toBe(before);
      expect((await ChangeRequestModel.findByPk(id))!.status).toBe(state);
    }
  });

  it('when a draft without cut items is submitted, then 400 on items', async () => {
    const s = await makeScene();
    const d = await request(t.app).post('/api/requests').set(s.users.designer.auth).send({ toolId: s.tool.id, title: 'Empty change', items: [] });
    const res = await act(s.users.designer, d.body.id, 'submit');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.items).toBeDefined();
  });

  it('when the cut is recorded without a report, or dated in the future, then 400 on cut', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    await readyToCut(t.app, s, id);
    const none = await act(s.users.toolmaker, id, 'record_cut', { cut: undefined });
    expect(none.status).toBe(400);
    expect(none.body.error.fieldErrors.cut).toBeDefined();
    const future = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { cutOn: '2999-01-01' }) });
    expect(future.status).toBe(400);
    expect(future.body.error.fieldErrors['cut.cutOn']).toBeDefined();
    const negative = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { actualCostCents: -5 }) });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fieldErrors['cut.actualCostCents']).toBeDefined();
    const misplaced = await act(s.users.engineer, id, 'rework', { cut: await cutFor(id) });
    expect(misplaced.status).toBe(400);
    expect(await signOffCount(id)).toBe(4);
  });

  it('when a request with safety flags is accepted without a re-test note, then 400; with one, then the note is kept', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'samples_review', 'insert', { items: [insertItem(s.visor.id, { safetyFlags: ['small_part'] })] });
    const missing = await act(s.users.engineer, id, 'accept_samples', { retestNote: '' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fieldErrors.retestNote).toBeDefined();
    const ok = await act(s.users.engineer, id, 'accept_samples', { retestNote: 'Small-parts cylinder test passed, lab report 88.' });
    expect(ok.status).toBe(201);
    expect(ok.body.request.retestNote).toBe('Small-parts cylinder test passed, lab report 88.');
    expect(ok.body.signOff.details.retestNote).toBe('Small-parts cylinder test passed, lab report 88.');
  });
});

describe('effects of the transitions', () => {
  it('when the brand lead sends a request back, then it goes to engineering review by default or to the designer when asked', async () => {
    const s = await makeScene();
    const a = await requestIn(t.app, s, 'brand_approval');
    const toReview = await act(s.users.lead, a, 'return');
    expect(toReview.body.request.status).toBe('engineering_review');
    expect(toReview.body.signOff.meaning).toMatch(/back to the tooling engineer/);
    const b = await requestIn(t.app, s, 'brand_approval');
    const toDraft = await act(s.users.lead, b, 'return', { target: 'draft' });
    expect(toDraft.status).toBe(201);
    expect(toDraft.body.request.status).toBe('draft');
    expect(toDraft.body.signOff).toMatchObject({ toStatus: 'draft', details: { target: 'draft' }, comment: 'Because return' });
    expect(toDraft.body.signOff.meaning).toMatch(/back to the designer/);
  });

  it('when the change is cleared to cut, then the factory\'s toolmaker sees it, the other factory does not, and the tool is in change', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'brand_approval');
    expect((await request(t.app).get(`/api/requests/${id}`).set(s.users.toolmaker.auth)).status).toBe(404);
    expect((await act(s.users.lead, id, 'approve')).status).toBe(201);
    const seen = await request(t.app).get(`/api/requests/${id}`).set(s.users.toolmaker.auth);
    expect(seen.status).toBe(200);
    expect(seen.body.permissions.actions).toEqual(['confirm_receipt', 'record_cut']);
    expect((await request(t.app).get(`/api/requests/${id}`).set(s.users.otherToolmaker.auth)).status).toBe(404);
    expect((await ToolModel.findByPk(s.tool.id))!.status).toBe('in_change');
    expect(seen.body.workflow.stageDueAt).not.toBeNull();
  });

  it('when the toolmaker records the cut, then the report is stored with the signer and the request waits for the samples', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    await readyToCut(t.app, s, id);
    const sent = await cutFor(id);
    const res = await act(s.users.toolmaker, id, 'record_cut', { cut: sent });
    expect(res.status).toBe(201);
    const cut = {
      ...CUT,
      shotReading: sent.shotReading,
      previousShotCount: sent.shotReading - CUT.trialShots,
      photoIds: [expect.any(String)],
      firstArticle: [expect.objectContaining({ measured: '12.43', pass: true })],
      firstArticlePass: true,
      recordedBy: { id: s.users.toolmaker.user.id, name: s.users.toolmaker.user.name },
      recordedAt: expect.any(String),
    };
    expect(res.body.request.workflow.cutReport).toEqual(cut);
    expect(res.body.signOff.details.cut).toEqual(cut);
    expect(res.body.request.workflow.waitingFor.map((w: { role: string }) => w.role).sort()).toEqual(['designer', 'engineer']);
  });

  it('when one role accepts the samples, then it waits for the other; rework forgets the acceptance; both accept, then closed', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'samples_review');
    const first = await act(s.users.designer, id, 'accept_samples');
    expect(first.body.request).toMatchObject({ status: 'samples_review', workflow: { acceptedByRoles: ['designer'] } });
    expect(first.body.request.workflow.waitingFor.map((w: { role: string }) => w.role)).toEqual(['engineer']);
    expect(first.body.signOff.meaning).toMatch(/design intent/);
    const rework = await act(s.users.engineer, id, 'rework');
    expect(rework.body.request).toMatchObject({ status: 'cut_authorized', workflow: { acceptedByRoles: [] } });
    expect((await act(s.users.toolmaker, id, 'record_cut')).status).toBe(201);
    expect((await act(s.users.engineer, id, 'accept_samples')).body.request.status).toBe('samples_review');
    const done = await act(s.users.designer, id, 'accept_samples');
    expect(done.body.request).toMatchObject({ status: 'closed', workflow: { waitingFor: [], stageDueAt: null } });
  });

  it('when a request closes, then the tool goes up one revision made by it, moved products are re-bound, ended ones stay and can no longer be made', async () => {
    const s = await makeScene();
    // The ridge on the head ends Kite and Kite Deluxe; Deluxe is moved to the new revision.
    const id = await requestIn(t.app, s, 'samples_review', 'ridge', { movedProductIds: [s.products.deluxe.id] });
    expect((await act(s.users.designer, id, 'accept_samples')).status).toBe(201);
    const closed = await act(s.users.engineer, id, 'accept_samples');
    expect(closed.status).toBe(201);
    expect(closed.body.request.status).toBe('closed');

    const tool = (await ToolModel.findByPk(s.tool.id))!;
    expect(tool).toMatchObject({ currentRevision: 2, status: 'active' });
    const rev = await ToolRevisionModel.findOne({ where: { toolId: s.tool.id, number: 2 } });
    expect(rev).toMatchObject({ changeRequestId: id, note: closed.body.request.title });
    const lines = await BillOfPartsModel.findAll({ where: { toolId: s.tool.id } });
    const revOf = (productId: string) => [...new Set(lines.filter((l) => l.productId === productId).map((l) => l.revision))];
    expect(revOf(s.products.deluxe.id)).toEqual([2]); // moved
    expect(revOf(s.products.storm.id)).toEqual([2]); // needs only the visor, untouched
    expect(revOf(s.products.kite.id)).toEqual([1]); // ended
    expect(revOf(s.products.heron.id)).toEqual([1]); // retired, left alone

    const kite = await request(t.app).get(`/api/products/${s.products.kite.id}`).set(s.users.engineer.auth);
    expect(kite.body.makeability.canBeMade).toBe(false);
    expect(kite.body.makeability.blockers[0].kind).toBe('revision_superseded');
    const deluxe = await request(t.app).get(`/api/products/${s.products.deluxe.id}`).set(s.users.engineer.auth);
    expect(deluxe.body.makeability.canBeMade).toBe(true);

    // The closed request still shows the impact as it was signed.
    const detail = await request(t.app).get(`/api/requests/${id}`).set(s.users.engineer.auth);
    expect(detail.body.impact.endedProducts.map((p: { id: string }) => p.id)).toEqual([s.products.kite.id]);
    expect(detail.body.impact.keptProducts.map((p: { id: string }) => p.id)).toEqual([s.products.deluxe.id]);
    expect(detail.body.workflow.baseRevision).toBe(1);
    const audit = await AuditEventModel.findOne({ where: { entity: 'tool', entityId: s.tool.id, action: 'tool.revise' } });
    expect(audit!.before).toEqual({ currentRevision: 1, status: 'in_change' });
    expect(audit!.after).toMatchObject({ currentRevision: 2, status: 'active', changeRequestId: id, endedProductIds: [s.products.kite.id] });
  });

  it('when the designer withdraws or the brand lead declines, then the request ends there and the tool is untouched', async () => {
    const s = await makeScene();
    const a = await requestIn(t.app, s, 'engineering_review');
    const w = await act(s.users.designer, a, 'withdraw');
    expect(w.body.request.status).toBe('withdrawn');
    expect(w.body.signOff).toMatchObject({ isSignature: false, decision: 'withdrawn', comment: 'Because withdraw' });
    const b = await requestIn(t.app, s, 'brand_approval');
    const d = await act(s.users.lead, b, 'decline');
    expect(d.body.request).toMatchObject({ status: 'declined', permissions: { actions: [] } });
    expect((await ToolModel.findByPk(s.tool.id))!).toMatchObject({ status: 'active', currentRevision: 1 });
  });

  it('when a request moves on, then the stage due date counts business days from the setting, and the audit trail has before and after', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'draft');
    const res = await act(s.users.designer, id, 'submit');
    const entered = new Date(res.body.request.workflow.stageEnteredAt);
    const due = new Date(res.body.request.workflow.stageDueAt);
    // 3 business days for engineering review (default); the calendar span is 3 to 5 days.
    const days = (due.getTime() - entered.getTime()) / 86_400_000;
    expect([3, 4, 5]).toContain(days);
    expect([0, 6]).not.toContain(due.getUTCDay());
    const ev = await AuditEventModel.findOne({ where: { entity: 'change_request', entityId: id, action: 'change_request.submit' } });
    expect(ev!.actorId).toBe(s.users.designer.user.id);
    expect(ev!.before).toMatchObject({ status: 'draft' });
    expect(ev!.after).toMatchObject({ status: 'engineering_review', signOff: { seq: 1, decision: 'submitted' } });
  });
});

describe('inbox', () => {
  type InboxRow = { id: string; waitingFor: string[]; overdue: boolean; irreversible: boolean; stageEnteredAt: string; stageDueAt: string | null };
  const inbox = async (user: SceneUser) => {
    const res = await request(t.app).get('/api/inbox').set(user.auth);
    expect(res.status).toBe(200);
    return inboxResponseSchema.parse(res.body).data as InboxRow[];
  };
  const waiting = (rows: InboxRow[], id: string) => rows.find((r) => r.id === id)?.waitingFor ?? null;

  it('when requests wait in every stage, then each user sees only what waits for their own action, within their brand or factory', async () => {
    const s = await makeScene();
    const draft = await requestIn(t.app, s, 'draft');
    const review = await requestIn(t.app, s, 'engineering_review', 'ridge');
    const approval = await requestIn(t.app, s, 'brand_approval', 'ridge');
    const cut = await requestIn(t.app, s, 'cut_authorized');
    const samples = await requestIn(t.app, s, 'samples_review');
    const halfAccepted = await requestIn(t.app, s, 'samples_review');
    expect((await act(s.users.designer, halfAccepted, 'accept_samples')).status).toBe(201);
    const closed = await requestIn(t.app, s, 'closed');
    const mine = [draft, review, approval, cut, samples, halfAccepted, closed];
    const pick = (rows: InboxRow[]) => Object.fromEntries(mine.filter((id) => waiting(rows, id)).map((id) => [id, waiting(rows, id)]));

    expect(pick(await inbox(s.users.designer))).toEqual({ [draft]: ['submit'], [samples]: ['accept_samples'] });
    expect(pick(await inbox(s.users.otherDesigner))).toEqual({ [samples]: ['accept_samples'] });
    expect(pick(await inbox(s.users.engineer))).toEqual({
      [review]: ['sign_review', 'return_to_draft'],
      [cut]: ['record_cut'],
      [samples]: ['accept_samples'],
      [halfAccepted]: ['accept_samples'],
    });
    expect(pick(await inbox(s.users.lead))).toEqual({ [approval]: ['approve', 'return', 'decline'] });
    expect(pick(await inbox(s.users.otherLead))).toEqual({});
    expect(pick(await inbox(s.users.toolmaker))).toEqual({ [cut]: ['confirm_receipt', 'record_cut'] });
    expect(pick(await inbox(s.users.otherToolmaker))).toEqual({});
    expect(await inbox(s.users.admin)).toEqual([]);
    const leadRow = (await inbox(s.users.lead)).find((r) => r.id === approval)!;
    expect(leadRow).toMatchObject({ irreversible: true, overdue: false, stageDueAt: expect.any(String) });
  });

  it('when some requests are overdue, then they come first, longest overdue first, then the oldest in their stage', async () => {
    const s = await makeScene();
    const ids: string[] = [];
    for (let i = 0; i < 4; i++) ids.push(await requestIn(t.app, s, 'brand_approval'));
    const [fresh, old, overdueLittle, overdueLong] = ids as [string, string, string, string];
    const now = Date.now();
    const h = 3_600_000;
    await ChangeRequestModel.update({ stageEnteredAt: new Date(now - 1 * h), stageDueAt: new Date(now + 40 * h) }, { where: { id: fresh } });
    await ChangeRequestModel.update({ stageEnteredAt: new Date(now - 20 * h), stageDueAt: new Date(now + 20 * h) }, { where: { id: old } });
    await ChangeRequestModel.update({ stageEnteredAt: new Date(now - 60 * h), stageDueAt: new Date(now - 2 * h) }, { where: { id: overdueLittle } });
    await ChangeRequestModel.update({ stageEnteredAt: new Date(now - 50 * h), stageDueAt: new Date(now - 30 * h) }, { where: { id: overdueLong } });
    const rows = await inbox(s.users.lead);
    expect(rows.filter((r) => ids.includes(r.id)).map((r) => [r.id, r.overdue])).toEqual([
      [overdueLong, true],
      [overdueLittle, true],
      [old, false],
      [fresh, false],
    ]);
  });
});
