import Decimal from 'decimal.js';
import { AuditEventModel, ChangeRequestModel } from '../../server/models';
import { requestNumbersSchema, toolOpenPlansSchema } from '../../shared/schemas/numbers';
import { makeUser, openTestApp, request } from './helpers';
import { makePart, makeProduct, makeTool } from './registry-helpers';
import { createDraft, insertItem, makeScene, putInState, ridgeItem, type Scene } from './request-fixtures';

const t = openTestApp();
afterAll(() => t.close());

type Who = { auth: Record<string, string> };
const getNumbers = (who: Who, id: string) => request(t.app).get(`/api/requests/${id}/numbers`).set(who.auth);
const putNumbers = (who: Who, id: string, body: Record<string, unknown>) => request(t.app).put(`/api/requests/${id}/numbers`).set(who.auth).send(body);

// An independent decimal.js (library defaults, more digits) for the cross-checks: the figures are
// recomputed here from the formulas of DESIGN section 5 and TRADE-FACTS 6.1 / 6.2, not with the
// project's own functions.
const Oracle = Decimal.clone({ precision: 50, rounding: Decimal.ROUND_HALF_UP });

const estimate = { modificationCostCents: 1_234_567, leadDays: 21, trialRoundsExpected: 2, newInsertCents: 1_900_000, duplicateToolCents: 2_600_000 };
const plan = { plannedUnits: 25_000, scrapRate: '0.025', freightPerUnitCents: 17, dutyPercent: '6.5' };

/** A request on the scene's tool, in engineering review, with Storm Kite as the derivative. */
async function inReview(s: Scene, items = [ridgeItem(s.head.id)]) {
  const d = await createDraft(t.app, s, { derivativeProductId: s.products.storm.id, items });
  await putInState(d.id, 'engineering_review');
  return d;
}

describe('who may read and change the numbers', () => {
  it('when the tooling engineer saves during engineering review, then 200 with the figures and the request version moves on', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const res = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate, plan });
    expect(res.status).toBe(200);
    expect(() => requestNumbersSchema.parse(res.body)).not.toThrow();
    expect(res.body).toMatchObject({ requestId: d.id, canEdit: true, readOnlyReason: null, status: 'engineering_review' });
    expect(res.body.version).toBe(d.version + 1);
    expect(res.body.inputs.estimate).toEqual(estimate);
    const row = await ChangeRequestModel.findByPk(d.id);
    expect(row!.estimate).toEqual(estimate);
    expect(row!.numbersInputs).toMatchObject({ plan: { plannedUnits: 25_000, scrapRate: '0.025', dutyPercent: '6.5' }, dimension: null, clamp: null });
  });

  it('when a brand lead or a designer reads, then they get the figures read-only; a toolmaker is refused; another brand\'s lead gets 404', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    await putNumbers(s.users.engineer, d.id, { version: d.version, estimate, plan });
    const lead = await getNumbers(s.users.lead, d.id);
    expect(lead.status).toBe(200);
    expect(lead.body).toMatchObject({ canEdit: false, readOnlyReason: expect.stringMatching(/engineer/) });
    expect(lead.body.result.economics.verdict.sentence).toMatch(/^Pays back after/);
    const designer = await getNumbers(s.users.designer, d.id);
    expect(designer.status).toBe(200);
    expect(designer.body.canEdit).toBe(false);
    expect((await getNumbers(s.users.otherLead, d.id)).status).toBe(404);
    // The toolmaker sees the request once it is cleared to cut, but not its prices and margins.
    await putInState(d.id, 'cut_authorized');
    expect((await request(t.app).get(`/api/requests/${d.id}`).set(s.users.toolmaker.auth)).status).toBe(200);
    expect((await getNumbers(s.users.toolmaker, d.id)).status).toBe(403);
  });

  it('when anyone but the engineer tries to save, then 403; when the engineer saves outside engineering review, then 409 wrong_state', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    for (const who of [s.users.designer, s.users.lead, s.users.admin, s.users.toolmaker]) {
      const res = await putNumbers(who, d.id, { version: d.version, estimate });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await putInState(d.id, 'brand_approval');
    const late = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('wrong_state');
    expect(late.body.error.message).toMatch(/engineering review/);
    expect((await ChangeRequestModel.findByPk(d.id))!.estimate).toBeNull();
  });

  it('when the request does not exist or the id is not a uuid, then 404', async () => {
    const s = await makeScene();
    expect((await getNumbers(s.users.engineer, '00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await getNumbers(s.users.engineer, 'CR-0001')).status).toBe(404);
  });
});

describe('validation', () => {
  it('when the estimate has a negative or fractional amount, then 400 with the field errors of engineerEstimateProblems and nothing is saved', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const res = await putNumbers(s.users.engineer, d.id, {
      version: d.version,
      estimate: { ...estimate, modificationCostCents: -1, leadDays: 2.5 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fieldErrors).toMatchObject({
      'estimate.modificationCostCents': ['Must be a whole number of zero or more'],
      'estimate.leadDays': ['Must be a whole number of zero or more'],
    });
    expect((await ChangeRequestModel.findByPk(d.id))!.estimate).toBeNull();
  });

  it('when plan and check inputs are out of range or not numbers, then 400 names each field (never a server error)', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const res = await putNumbers(s.users.engineer, d.id, {
      version: d.version,
      plan: { scrapRate: '1.2', dutyPercent: '-3', currency: 'XYZ1', plannedUnits: 0 },
      dimension: { oldPartMm: '0', newPartMm: '32', resinId: 'unobtainium' },
      clamp: { projectedArea: 'forty', factorId: 'ji_horng_abs', safetyFactor: '0.9', pressTonnage: '1e3' },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(
      [
        'clamp.pressTonnage',
        'clamp.projectedArea',
        'clamp.safetyFactor',
        'dimension.oldPartMm',
        'dimension.resinId',
        'plan.currency',
        'plan.dutyPercent',
        'plan.plannedUnits',
        'plan.scrapRate',
      ].sort(),
    );
  });

  it('when the version is stale, then 409 stale_version with the current figures, and the newer save is kept', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const first = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate });
    expect(first.status).toBe(200);
    const stale = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate: { ...estimate, modificationCostCents: 1 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(stale.body.error.current).toMatchObject({ requestId: d.id, version: first.body.version });
    expect(stale.body.error.current.inputs.estimate.modificationCostCents).toBe(1_234_567);
    expect((await ChangeRequestModel.findByPk(d.id))!.estimate).toMatchObject({ modificationCostCents: 1_234_567 });
  });

  it('when the same inputs are saved again, then the version stays and no audit event is added; a real change is audited with before and after', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const first = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate, plan });
    const again = await putNumbers(s.users.engineer, d.id, { version: first.body.version, estimate, plan });
    expect(again.status).toBe(200);
    expect(again.body.version).toBe(first.body.version);
    const events = await AuditEventModel.findAll({ where: { action: 'change_request.numbers', entityId: d.id } });
    expect(events).toHaveLength(1);
    expect(events[0]!.actorId).toBe(s.users.engineer.user.id);
    expect(events[0]!.before).toEqual({ estimate: null, numbersInputs: null });
    expect((events[0]!.after as { estimate: unknown }).estimate).toEqual(estimate);
  });
});

describe('the figures', () => {
  it('when the estimate and plan are saved, then every figure matches an independent decimal.js computation', async () => {
    const s = await makeScene();
    // Storm Kite (the derivative): FOB $3.00, wholesale $6.50, retail $12.99 (registry-helpers).
    const d = await inReview(s);
    const res = await putNumbers(s.users.engineer, d.id, { version: d.version, estimate, plan });
    const r = res.body.result;
    const fob = new Oracle(300);
    const wholesale = new Oracle(650);
    const retail = new Oracle(1299);

    // Duty = FOB x 6.5 %, half-up to the cent: 19.5 -> 20 (TRADE-FACTS 6.2 build-up; rounding is our stated rule).
    const duty = fob.times('6.5').div(100).toDecimalPlaces(0, Decimal.ROUND_HALF_UP);
    const landed = fob.plus(17).plus(duty);
    expect(r.plan.dutyCents).toBe(duty.toNumber());
    expect(r.plan.landedCents).toBe(landed.toNumber());
    expect(r.plan.fobCents).toEqual({ value: 300, from: 'product' });
    expect(r.plan.plannedUnits).toEqual({ value: 25_000, from: 'entered' });

    // Break-even = FC / (P - K), Stanford EE204 (TRADE-FACTS 6.1), rounded up to a whole unit.
    const contribution = wholesale.minus(landed);
    const beQuotient = new Oracle(estimate.modificationCostCents).div(contribution);
    expect(r.economics.breakEven.contributionCents).toBe(contribution.toNumber());
    expect(r.economics.breakEven.units).toBe(beQuotient.ceil().toNumber());
    expect(r.economics.breakEven.exactUnits).toBe(beQuotient.toFixed(4));
    expect(r.economics.verdict).toEqual({
      paysBack: true,
      sentence: `Pays back after ${beQuotient.ceil().toNumber().toLocaleString('en-US')} units of 25,000 planned`,
    });

    // Tooling per unit = tool cost / units ($50,000 over 50,000 parts = $1, TRADE-FACTS 6.1), rounded up to the cent.
    const perUnit = new Oracle(estimate.modificationCostCents).div(25_000).ceil();
    expect(r.economics.amortisation.perUnitCents).toBe(perUnit.toNumber());
    expect(r.economics.routes.map((x: { perUnitCents: number }) => x.perUnitCents)).toEqual(
      [estimate.modificationCostCents, estimate.newInsertCents, estimate.duplicateToolCents].map((c) => new Oracle(c).div(25_000).ceil().toNumber()),
    );

    // Margin = (price - cost) / price, two decimals half-up (TRADE-FACTS 6.2, keystone = 50 %).
    const [brand, retailer] = r.economics.buildUp.steps;
    expect(brand.marginPercent).toBe(wholesale.minus(landed).div(wholesale).times(100).toFixed(2));
    expect(retailer.marginPercent).toBe(retail.minus(wholesale).div(retail).times(100).toFixed(2));
    expect(r.economics.buildUp.retailToFobMultiple).toBe(retail.div(fob).toFixed(2));

    // Savings against the ways that keep the ended products alive.
    expect(r.economics.alternatives.versusNewInsert.savingsCents).toBe(1_900_000 - 1_234_567);
    expect(r.economics.alternatives.versusDuplicateTool.savingsCents).toBe(2_600_000 - 1_234_567);
    expect(r.economics.alternatives.cheapest).toBe('modify');

    // Shots = ceil(units x parts per unit / cavities x (1 + scrap)) (DESIGN section 5): the head has 2 cavities.
    const shots = new Oracle(25_000).times(1).div(2).times(new Oracle(1).plus('0.025')).ceil();
    expect(r.run.plan.shotsNeeded).toBe(shots.toNumber());
    // Remaining = rated - shot count: class 103, 500,000 (Kaysun, TRADE-FACTS 1.1) - 1,000 shots.
    expect(r.run.remainingShots).toBe(500_000 - 1000);
    expect(r.run.plan.enough).toBe(true);
    expect(r.run.parts[0]).toMatchObject({ partName: 'Head', cavitiesPerShot: 2, partsPerUnit: 1, partsPerUnitFrom: 'assumed' });
    expect(r.assumptions).toContain("Parts per unit not entered and not in the derivative's bill of parts: 1 counted.");
  });

  it('when the estimate gives the costs of the ways to keep, then the request detail\'s impact shows them too', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    await putNumbers(s.users.engineer, d.id, { version: d.version, estimate });
    const detail = await request(t.app).get(`/api/requests/${d.id}`).set(s.users.lead.auth);
    expect(detail.body.impact.waysToKeep.map((w: { kind: string; costCents: number }) => [w.kind, w.costCents])).toEqual([
      ['new_insert', 1_900_000],
      ['duplicate_tool', 2_600_000],
    ]);
  });

  it('when dimension and clamp checks are given, then their results come with the convention and the factor source', async () => {
    const s = await makeScene();
    const d = await inReview(s);
    const res = await putNumbers(s.users.engineer, d.id, {
      version: d.version,
      dimension: { oldPartMm: '100', newPartMm: '100.5', resinId: 'abs', shrink: '0.006', convention: 'astm_d955', formedBy: 'recess' },
      clamp: { projectedArea: '36', areaUnit: 'in2', factorId: 'pdi_general', factor: '2', safetyFactor: '1', pressTonnage: '70', pressUnit: 'short_tons' },
    });
    expect(res.status).toBe(200);
    const { dimension, clamp } = res.body.result;
    // ASTM D955: steel = part / (1 - S); 100 / 0.994 = 100.60362173... (TRADE-FACTS 9, decimal.js 10.6.0).
    expect(dimension.change.oldSteelMm).toBe(new Oracle(100).div(new Oracle(1).minus('0.006')).toFixed(3));
    expect(dimension.change.newSteelMm).toBe(new Oracle('100.5').div(new Oracle(1).minus('0.006')).toFixed(3));
    expect(dimension.change.action).toBe('remove_steel');
    expect(dimension.convention).toMatchObject({ id: 'astm_d955', formula: 'steel = part / (1 - S)' });
    expect(dimension.shrinkFrom).toBe('entered');
    // 36 in² x 2 short tons/in² = 72 short tons (the correct figure; genesisllc.com's "90" is listed as wrong in TRADE-FACTS 10).
    expect(clamp.check.requiredShortTons).toBe('72.00');
    expect(clamp.check.pressOk).toBe(false);
    expect(clamp.factor.source).toMatch(/plasticdesign\.com/);
  });
});

describe("a tool's life against all open plans", () => {
  it('when the open plans together outrun the tool, then the total and a warning; finished requests are not counted', async () => {
    const s = await makeScene();
    // A worn tool: 40,000 rated (the mold maker's figure), 20,000 run, so 20,000 left.
    const tool = await makeTool({ brandId: s.brand.id, factoryId: s.factory.id, ratedShots: 40_000, shotCount: 20_000 });
    const head = await makePart(tool.id, 'Head', 2);
    const visor = await makePart(tool.id, 'Visor', 4);
    const derivative = await makeProduct(s.brand.id, { name: 'Storm Kite II' });

    const a = await createDraft(t.app, s, { toolId: tool.id, derivativeProductId: derivative.id, items: [ridgeItem(head.id)] });
    const b = await createDraft(t.app, s, { toolId: tool.id, derivativeProductId: derivative.id, items: [insertItem(visor.id), ridgeItem(head.id)] });
    const gone = await createDraft(t.app, s, { toolId: tool.id, derivativeProductId: derivative.id, items: [ridgeItem(head.id)] });
    const bare = await createDraft(t.app, s, { toolId: tool.id, items: [ridgeItem(head.id)] });
    for (const [d, units, scrap] of [
      [a, 25_000, '0.025'],
      [b, 16_000, '0'],
      [gone, 900_000, '0'],
    ] as const) {
      await putInState(d.id, 'engineering_review');
      const res = await putNumbers(s.users.engineer, d.id, { version: d.version, plan: { plannedUnits: units, scrapRate: scrap } });
      expect(res.status).toBe(200);
    }
    await putInState(gone.id, 'withdrawn');

    const res = await request(t.app).get(`/api/tools/${tool.id}/open-plans`).set(s.users.lead.auth);
    expect(res.status).toBe(200);
    expect(() => toolOpenPlansSchema.parse(res.body)).not.toThrow();
    const byId = Object.fromEntries(res.body.plans.map((p: { requestId: string }) => [p.requestId, p]));
    expect(Object.keys(byId).sort()).toEqual([a.id, b.id, bare.id].sort());
    // a: ceil(25,000 x 1 / 2 x 1.025) = 12,813; b: the head (2 cavities) needs more shots than the visor (4): 16,000 / 2 = 8,000.
    const aShots = new Oracle(25_000).div(2).times('1.025').ceil().toNumber();
    expect(byId[a.id]).toMatchObject({ shotsNeeded: aShots, plannedUnits: 25_000, governingPart: 'Head' });
    expect(byId[b.id]).toMatchObject({ shotsNeeded: 8_000, governingPart: 'Head' });
    // No derivative and no planned units: no figures, and said so.
    expect(byId[bare.id]).toMatchObject({ shotsNeeded: null, plannedUnits: null });
    expect(res.body.total).toMatchObject({
      remainingShots: 20_000,
      totalShots: aShots + 8_000,
      plansCounted: 2,
      plansWithoutFigures: 1,
      enough: false,
      shortfall: aShots + 8_000 - 20_000,
    });
    expect(res.body.total.warning).toMatch(/short/);

    // The tool detail lists the same open changes.
    const detail = await request(t.app).get(`/api/tools/${tool.id}`).set(s.users.lead.auth);
    expect(detail.body.openChanges.map((c: { id: string }) => c.id).sort()).toEqual([a.id, b.id, bare.id].sort());
  });

  it('when a toolmaker asks, then only the changes released to their factory count; another factory gets 404', async () => {
    const s = await makeScene();
    const released = await inReview(s);
    await putNumbers(s.users.engineer, released.id, { version: released.version, plan: { plannedUnits: 10_000 } });
    await putInState(released.id, 'cut_authorized');
    await inReview(s);
    const own = await request(t.app).get(`/api/tools/${s.tool.id}/open-plans`).set(s.users.toolmaker.auth);
    expect(own.status).toBe(200);
    expect(own.body.plans.map((p: { requestId: string }) => p.requestId)).toEqual([released.id]);
    expect(own.body.total.totalShots).toBe(5_000);
    const other = await request(t.app).get(`/api/tools/${s.tool.id}/open-plans`).set(s.users.otherToolmaker.auth);
    expect(other.status).toBe(404);
    const anon = await makeUser('designer');
    expect((await request(t.app).get(`/api/tools/${s.tool.id}/open-plans`).set(anon.auth)).status).toBe(200);
  });
});
