// The factory's side of a change: receipt of the cut sheet before the cut, the cut report with its
// sample photo, shot counter reading and first-article report, and errors in the reader's language.
import { ChangeRequestModel, SignOffModel, ToolModel } from '../../server/models';
import { openTestApp, request } from './helpers';
import { insertItem, makeScene, ridgeItem } from './request-fixtures';
import { actWith, addSamplePhoto, cutFor, readyToCut, requestIn, signOffCount } from './workflow-fixtures';

const t = openTestApp();
afterAll(() => t.close());
const act = actWith(t.app);

describe('receipt of the cut sheet', () => {
  it('when the cut is recorded before the factory confirmed receipt, then 422 naming the receipt, and nothing is signed', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    await addSamplePhoto(t.app, s.users.toolmaker, id);
    const before = await signOffCount(id);
    for (const who of [s.users.toolmaker, s.users.engineer]) {
      const res = await act(who, id, 'record_cut');
      expect([res.status, res.body.error.code]).toEqual([422, 'receipt_missing']);
      expect(res.body.error.message).toMatch(/confirm(ed)? receipt of the cut sheet/);
      expect(res.body.error.fieldErrors.receipt).toBeDefined();
    }
    expect(await signOffCount(id)).toBe(before);
    expect((await ChangeRequestModel.findByPk(id))!.status).toBe('cut_authorized');
  });

  it('when the factory\'s toolmaker confirms receipt, then a signature with its time joins the chain, the state stays, and a second receipt is refused', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    const res = await act(s.users.toolmaker, id, 'confirm_receipt');
    expect(res.status).toBe(201);
    expect(res.body.signOff).toMatchObject({
      action: 'confirm_receipt',
      decision: 'received',
      isSignature: true,
      fromStatus: 'cut_authorized',
      toStatus: 'cut_authorized',
      signer: { id: s.users.toolmaker.user.id },
      signedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/),
    });
    expect(res.body.signOff.meaning).toMatch(/received the signed cut sheet for tool/);
    expect(res.body.request.status).toBe('cut_authorized');
    expect(res.body.request.permissions.actions).toEqual(['record_cut']);
    expect((await ChangeRequestModel.findByPk(id))!.cutSheetReceivedAt).toBeInstanceOf(Date);
    const again = await act(s.users.toolmaker, id, 'confirm_receipt');
    expect([again.status, again.body.error.code]).toEqual([409, 'wrong_state']);
    const verify = await request(t.app).get(`/api/requests/${id}/sign-offs/verify`).set(s.users.engineer.auth);
    expect(verify.body.intact).toBe(true);
  });

  it('when another factory\'s toolmaker confirms receipt, then 404 and nothing is signed', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    const res = await act(s.users.otherToolmaker, id, 'confirm_receipt');
    expect(res.status).toBe(404);
    expect(await SignOffModel.count({ where: { requestId: id, action: 'confirm_receipt' } })).toBe(0);
  });
});

describe('record the cut', () => {
  it('when no photo of the first samples was added, then 422 asking for one', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    expect((await act(s.users.toolmaker, id, 'confirm_receipt')).status).toBe(201);
    const res = await act(s.users.toolmaker, id, 'record_cut');
    expect([res.status, res.body.error.code]).toEqual([422, 'sample_photo_missing']);
    expect(res.body.error.fieldErrors['cut.photos']).toBeDefined();
  });

  it('when the shot counter reads lower than the count on record, then 422 with both figures and the count stays; a higher reading becomes the count', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized');
    await readyToCut(t.app, s, id);
    const recorded = Number((await ToolModel.findByPk(s.tool.id))!.shotCount);
    expect(recorded).toBeGreaterThan(0);
    const low = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { shotReading: recorded - 1 }) });
    expect([low.status, low.body.error.code]).toEqual([422, 'shot_reading_lower']);
    expect(low.body.error.message).toContain(`lower than the ${recorded.toLocaleString('en-US')} shots on record`);
    expect(low.body.error.fieldErrors['cut.shotReading']).toBeDefined();
    expect(Number((await ToolModel.findByPk(s.tool.id))!.shotCount)).toBe(recorded);
    const ok = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { shotReading: recorded + 150 }) });
    expect(ok.status).toBe(201);
    expect(Number((await ToolModel.findByPk(s.tool.id))!.shotCount)).toBe(recorded + 150);
    expect(ok.body.request.workflow.cutReport).toMatchObject({ shotReading: recorded + 150, previousShotCount: recorded });
  });

  it('when an item is out of tolerance, then it fails and the report fails; designer and engineer see every line when they decide', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized', 'ridge', { items: [ridgeItem(s.head.id), insertItem(s.visor.id)] });
    await readyToCut(t.app, s, id);
    const [first, second] = (await cutFor(id)).firstArticle;
    // 12.40 ± 0.05 admits 12.35 to 12.45, limits included (limits of size: nominal ± tolerance).
    const firstArticle = [
      { ...first!, intended: '12.40', tolerance: '0.05', measured: '12.45' },
      { ...second!, intended: '8.00', tolerance: '0.10', measured: '7.89' },
    ];
    const res = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { firstArticle }) });
    expect(res.status).toBe(201);
    for (const who of [s.users.designer, s.users.engineer]) {
      const seen = await request(t.app).get(`/api/requests/${id}`).set(who.auth);
      const report = seen.body.workflow.cutReport;
      expect(report.firstArticlePass).toBe(false);
      expect(report.firstArticle.map((l: { position: number; measured: string; deviation: string; pass: boolean }) => [l.position, l.measured, l.deviation, l.pass])).toEqual([
        [0, '12.45', '0.05', true],
        [1, '7.89', '-0.11', false],
      ]);
      expect(seen.body.permissions.actions).toEqual(expect.arrayContaining(['accept_samples', 'rework']));
    }
  });

  it('when a cut item is left out of the first-article report, or the trial is dated before the cut, then 400 on that field', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'cut_authorized', 'ridge', { items: [ridgeItem(s.head.id), insertItem(s.visor.id)] });
    await readyToCut(t.app, s, id);
    const full = await cutFor(id);
    const short = await act(s.users.toolmaker, id, 'record_cut', { cut: { ...full, firstArticle: full.firstArticle.slice(0, 1) } });
    expect(short.status).toBe(400);
    expect(short.body.error.fieldErrors['cut.firstArticle'][0]).toMatch(/item 2 missing/);
    const early = await act(s.users.toolmaker, id, 'record_cut', { cut: { ...full, trialOn: '2026-11-01' } });
    expect(early.status).toBe(400);
    expect(early.body.error.fieldErrors['cut.trialOn']).toBeDefined();
    const noCurrency = await act(s.users.toolmaker, id, 'record_cut', { cut: { ...full, currency: 'dollars' } });
    expect(noCurrency.status).toBe(400);
    expect(noCurrency.body.error.fieldErrors['cut.currency']).toBeDefined();
  });
});

describe('errors in the reader\'s language', () => {
  it('when a toolmaker who reads simplified Chinese is refused, then the message is in Chinese and the code stays', async () => {
    const s = await makeScene();
    const set = await request(t.app).put('/api/me/language').set(s.users.toolmaker.auth).send({ language: 'zh-Hans' });
    expect([set.status, set.body.language]).toEqual([200, 'zh-Hans']);
    const id = await requestIn(t.app, s, 'cut_authorized');
    await addSamplePhoto(t.app, s.users.toolmaker, id);
    const res = await act(s.users.toolmaker, id, 'record_cut');
    expect([res.status, res.body.error.code]).toEqual([422, 'receipt_missing']);
    expect(res.body.error.message).toBe('未签署：工厂尚未确认收到改模单。请先确认签收，再登记改模完成。');
    expect(res.body.error.message).not.toMatch(/[A-Za-z]{3,}/);
    expect((await act(s.users.toolmaker, id, 'confirm_receipt')).status).toBe(201);
    const recorded = Number((await ToolModel.findByPk(s.tool.id))!.shotCount);
    const low = await act(s.users.toolmaker, id, 'record_cut', { cut: await cutFor(id, { shotReading: 5 }) });
    expect(low.body.error.message).toContain(`计数器读数 5 低于模具 ${s.tool.code} 记录中的 ${recorded.toLocaleString('en-US')} 啤`);
    // The same refusal for an English reader stays in English.
    const en = await act(s.users.engineer, id, 'record_cut', { cut: await cutFor(id, { shotReading: 5 }) });
    expect(en.body.error.message).toMatch(/^Nothing was signed: the shot counter reading 5 is lower/);
  });

  it('when a language that is not offered is picked, then 400 on language', async () => {
    const s = await makeScene();
    const res = await request(t.app).put('/api/me/language').set(s.users.toolmaker.auth).send({ language: 'fr' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.language).toBeDefined();
  });
});
