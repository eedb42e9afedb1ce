// Demo change requests in the later states of the lifecycle (invented), each taken there through
// the sign-off workflow itself (server/services/workflow.ts applyAction) with dated steps, so every
// one has a real, verifiable sign-off chain, due dates and audit events:
//  - brand sign-off, overdue: deeper feather texture on the Osprey wings (cannot be undone; the
//    Osprey is moved to the new revision, so it ends nothing)
//  - cleared to cut: a replacement display-stand insert with the anniversary logo (can be undone)
//  - first samples in review, accepted by the designer: thicker roll-cage bars on the Dune Buggy
//  - closed: a stiffening rib under the Dune Buggy chassis; the tool went to revision 2 and the
//    three vehicles that use the chassis were re-bound to it
//  - declined: a spiky crest on the Heron head (a sharp-point concern for the age grade)
//  - withdrawn: a taller spoiler for the Turbo
// Mail is not sent for seeded history.
import type { Transaction } from 'sequelize';
import type { TakeActionInput } from '../../shared/schemas/request-actions';
import type { Actor } from '../lib/auth';
import { ChangeItemModel, ChangeRequestModel, ToolModel } from '../models';
import { applyAction } from '../services/workflow';
import { DEMO_PASSWORD } from './organisation';
import { EMPTY_PLAN } from '../../shared/domain/request-numbers';
import type { SeedEstimate, SeedRequest, SeedStep } from './requests';

const DESIGNER = 'designer@kestrelbay.example';
const ENGINEER = 'engineer@kestrelbay.example';
const RANGERS_LEAD = 'brandlead@kestrelbay.example';
const RACERS_LEAD = 'racerslead@kestrelbay.example';
const PEARL_DELTA_TOOLMAKER = 'toolmaker@pearldelta.example';

const DAY = 86_400_000;

/** A drawn stand-in for a photo of a first-shot part on the inspection table (640 x 480). */
const firstShotPhoto =
  '<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480" viewBox="0 0 640 480"><rect width="640" height="480" fill="#E8E4DA"/>' +
  '<rect x="140" y="150" width="360" height="180" rx="24" fill="#C2410C" stroke="#17212B" stroke-width="4"/>' +
  '<rect x="180" y="190" width="280" height="100" rx="12" fill="none" stroke="#17212B" stroke-width="6"/>' +
  '<line x1="100" y1="380" x2="540" y2="380" stroke="#17212B" stroke-width="3"/></svg>';

export const workflowDemoRequests: SeedRequest[] = [
  {
    toolCode: 'KB-T-0420',
    title: 'Deeper feather texture on the Osprey wings',
    reason:
      'Retail feedback: the wing feathers read flat under store lighting. A deeper texture in the wing cavities gives the paint wash something to catch. The Osprey itself moves to the new revision.',
    derivativeSku: null,
    noDerivativeReason: 'The Osprey itself moves to the new revision: a refresh of the figure in line, not a new product.',
    estimate: { currency: 'USD', modificationCostCents: 240_000, leadDays: 15, trialRoundsExpected: 1 },
    targetInDays: 60,
    status: 'brand_approval',
    submitter: DESIGNER,
    items: [
      {
        part: 'Wing pair',
        effect: 'surface_only',
        method: 'texture',
        size: '0.15',
        unit: 'mm',
        note: 'Re-texture the feather field on both wing cavities 0.15 mm deeper; keep the leading edge polished.',
        safetyFlags: [],
      },
    ],
    movedSkus: ['SR-1003'],
    images: [],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 12, comment: 'Texture sample plaque approved by the sculpt team.' },
      { by: ENGINEER, action: 'sign_review', daysAgo: 9, comment: 'Texture depth within the draft angle of the wing walls; no release issue expected.' },
    ],
  },
  {
    toolCode: 'KB-T-0431',
    title: 'Anniversary logo on a replacement display-stand insert',
    reason: 'The 25th-anniversary wave ships on a stand with the anniversary logo. A replacement stand insert keeps the current one for the regular line.',
    derivativeSku: null,
    noDerivativeReason: 'The anniversary wave re-uses the figures in line; only the stand changes, on its own insert.',
    estimate: { currency: 'USD', modificationCostCents: 310_000, leadDays: 20, trialRoundsExpected: 1 },
    targetInDays: 45,
    status: 'cut_authorized',
    submitter: DESIGNER,
    items: [
      {
        part: 'Display stand',
        effect: 'insert_swapped',
        method: 'new_insert',
        size: '62',
        unit: 'mm',
        note: 'New stand-top insert with the raised anniversary logo, same 62 mm footprint; store the current insert labelled.',
        safetyFlags: [],
      },
    ],
    images: [],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 9 },
      { by: ENGINEER, action: 'sign_review', daysAgo: 7 },
      { by: RANGERS_LEAD, action: 'approve', daysAgo: 6, comment: 'Approved for the anniversary wave.' },
    ],
  },
  {
    toolCode: 'KB-T-0511',
    title: 'Thicker roll-cage bars on the Dune Buggy',
    reason: 'Returns show roll cages snapping at the rear hoop. Bars 0.5 mm thicker pass the drop test in the prototype; the Dune Buggy moves to the new revision.',
    derivativeSku: null,
    noDerivativeReason: 'A fix to the Dune Buggy in line, which moves to the new revision.',
    estimate: { currency: 'USD', modificationCostCents: 180_000, leadDays: 12, trialRoundsExpected: 1 },
    targetInDays: 30,
    status: 'samples_review',
    submitter: DESIGNER,
    items: [
      {
        part: 'Roll cage',
        effect: 'gains_plastic',
        method: 'cut',
        size: '0.5',
        unit: 'mm',
        note: 'Open every bar of the roll-cage cavity by 0.5 mm in diameter; blend at the joints.',
        safetyFlags: ['thin_wall'],
      },
    ],
    movedSkus: ['MR-2001'],
    images: [{ kind: 'sample', filename: 'roll-cage-first-shot.png', svg: firstShotPhoto }],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 24 },
      { by: ENGINEER, action: 'sign_review', daysAgo: 22 },
      { by: RACERS_LEAD, action: 'approve', daysAgo: 21, comment: 'Go: the returns cost more than the cut.' },
      { by: PEARL_DELTA_TOOLMAKER, action: 'confirm_receipt', daysAgo: 20 },
      {
        by: PEARL_DELTA_TOOLMAKER,
        action: 'record_cut',
        daysAgo: 6,
        cut: {
          actualCostCents: 186_000,
          currency: 'USD',
          note: 'Cut by EDM, both cage cavities; first shots taken on the same day.',
          trialShots: 120,
          firstArticle: [{ intended: '2.50', tolerance: '0.05', measured: '2.53' }],
        },
      },
      {
        by: DESIGNER,
        action: 'accept_samples',
        daysAgo: 3,
        comment: 'Bars look right in hand.',
        retestNote: 'Drop and torque tests on 20 first-shot cages passed at the accredited lab (report MR-7731); the age-grade use-and-abuse tests are repeated there before shipping.',
      },
    ],
  },
  {
    toolCode: 'KB-T-0510',
    title: 'Stiffening rib under the Dune Buggy chassis',
    reason: 'The chassis flexes when the body is clipped on. A 1.2 mm rib under the floor stops it; all three vehicles that use the chassis move to the new revision.',
    derivativeSku: null,
    noDerivativeReason: 'A fix to the chassis of three vehicles in line, which all move to the new revision.',
    estimate: { currency: 'USD', modificationCostCents: 95_000, leadDays: 10, trialRoundsExpected: 1 },
    targetInDays: null,
    status: 'closed',
    submitter: DESIGNER,
    items: [
      {
        part: 'Chassis',
        effect: 'gains_plastic',
        method: 'cut',
        size: '1.2',
        unit: 'mm',
        note: 'Cut a 1.2 mm deep, 2 mm wide rib channel along the floor centre line, ending 4 mm short of the axle bosses.',
        safetyFlags: [],
      },
    ],
    movedSkus: ['MR-2001', 'MR-2002', 'MR-2101'],
    images: [{ kind: 'sample', filename: 'chassis-first-shot.png', svg: firstShotPhoto }],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 58 },
      { by: ENGINEER, action: 'sign_review', daysAgo: 55 },
      { by: RACERS_LEAD, action: 'approve', daysAgo: 54 },
      { by: PEARL_DELTA_TOOLMAKER, action: 'confirm_receipt', daysAgo: 53 },
      {
        by: PEARL_DELTA_TOOLMAKER,
        action: 'record_cut',
        daysAgo: 40,
        cut: {
          actualCostCents: 94_000,
          currency: 'USD',
          note: 'Rib channel milled; no change to ejection.',
          trialShots: 80,
          firstArticle: [{ intended: '1.20', tolerance: '0.05', measured: '1.18' }],
        },
      },
      { by: ENGINEER, action: 'accept_samples', daysAgo: 37, comment: 'Flex test passed; dimensions within the drawing.' },
      { by: DESIGNER, action: 'accept_samples', daysAgo: 36 },
    ],
  },
  {
    toolCode: 'KB-T-0388',
    title: 'Spiky crest on the Heron head for a Night Heron',
    reason: 'A night-heron variant with a raised crest of thin spikes.',
    derivativeSku: null,
    noDerivativeReason: 'The Night Heron is not in the product registry yet: it is added once the crest is agreed.',
    estimate: { currency: 'USD', modificationCostCents: 420_000, leadDays: 25, trialRoundsExpected: 2 },
    targetInDays: null,
    status: 'declined',
    submitter: DESIGNER,
    items: [
      {
        part: 'Head',
        effect: 'gains_plastic',
        method: 'cut',
        size: '3',
        unit: 'mm',
        note: 'Five crest spikes, 3 mm tall, tapering to 0.4 mm tips.',
        safetyFlags: ['point_or_edge', 'thin_wall'],
      },
    ],
    images: [],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 20 },
      { by: ENGINEER, action: 'sign_review', daysAgo: 18, comment: 'Tips this thin will need the sharp-point test for the age grade.' },
      {
        by: RANGERS_LEAD,
        action: 'decline',
        daysAgo: 17,
        comment: 'Not for a 4+ line: thin spiky tips are a sharp-point risk. Come back with a rounded crest.',
      },
    ],
  },
  {
    toolCode: 'KB-T-0530',
    title: 'Taller rear spoiler for the Turbo',
    reason: 'A taller spoiler for the Turbo sample run.',
    derivativeSku: 'MR-2101',
    targetInDays: null,
    status: 'withdrawn',
    submitter: DESIGNER,
    items: [{ part: 'Spoiler', effect: 'gains_plastic', method: 'cut', size: '6', unit: 'mm', note: 'Raise the spoiler blade 6 mm.', safetyFlags: [] }],
    images: [],
    history: [
      { by: DESIGNER, action: 'submit', daysAgo: 15 },
      { by: DESIGNER, action: 'withdraw', daysAgo: 13, comment: 'Marketing kept the current spoiler for the Turbo sample run.' },
    ],
  },
];

/**
 * Runs the history of a freshly inserted seed request through the workflow, dated `daysAgo`, and
 * dates the request's own creation and last change to match. The result must be `spec.status`.
 */
export async function runSeedHistory(transaction: Transaction, requestId: string, spec: SeedRequest, actorFor: (email: string) => Promise<Actor>) {
  const steps = spec.history ?? [];
  if (!steps.length) {
    if (spec.status !== 'draft') throw new Error(`Seed request "${spec.title}" is ${spec.status} but has no history`);
    return;
  }
  const now = Date.now();
  for (const step of steps) {
    const at = new Date(now - step.daysAgo * DAY);
    const actor = await actorFor(step.by);
    if (step.action === 'sign_review' && spec.estimate) await enterEstimate(transaction, requestId, spec.estimate);
    await applyAction({ sequelize: ChangeRequestModel.sequelize!, transaction }, actor, requestId, await inputFor(transaction, requestId, step, at), { at });
  }
  const r = (await ChangeRequestModel.findByPk(requestId, { transaction }))!;
  if (r.status !== spec.status) throw new Error(`Seed request "${spec.title}" ended ${r.status}, not ${spec.status}`);
  const first = new Date(now - steps[0]!.daysAgo * DAY - DAY / 4);
  const last = new Date(now - steps[steps.length - 1]!.daysAgo * DAY);
  await ChangeRequestModel.sequelize!.query('UPDATE change_requests SET created_at = :first, updated_at = :last WHERE id = :id', {
    replacements: { first, last, id: requestId },
    transaction,
  });
}

/** The engineer's estimate and its currency, entered during the review (the review's gate needs them). */
async function enterEstimate(transaction: Transaction, id: string, estimate: SeedEstimate) {
  const r = (await ChangeRequestModel.findByPk(id, { transaction }))!;
  const { currency, ...e } = estimate;
  r.estimate = { trialRoundsExpected: null, newInsertCents: null, duplicateToolCents: null, ...e };
  r.numbersInputs = { plan: { ...EMPTY_PLAN, currency }, dimension: null, clamp: null };
  await r.save({ transaction });
}

async function inputFor(transaction: Transaction, id: string, step: SeedStep, at: Date): Promise<TakeActionInput> {
  const r = (await ChangeRequestModel.findByPk(id, { transaction }))!;
  const input: TakeActionInput = { action: step.action, version: r.version };
  if (step.comment) input.comment = step.comment;
  if (step.target) input.target = step.target;
  if (step.retestNote) input.retestNote = step.retestNote;
  if (step.cut) {
    // The trial runs the day of the cut; the counter reads the tool's shots plus the trial's.
    const tool = (await ToolModel.findByPk(r.toolId, { attributes: ['id', 'shotCount'], transaction }))!;
    const items = await ChangeItemModel.findAll({ where: { requestId: id }, attributes: ['id', 'position'], order: [['position', 'ASC']], transaction });
    const day = at.toISOString().slice(0, 10);
    const { firstArticle, trialShots, ...rest } = step.cut;
    input.cut = {
      ...rest,
      cutOn: day,
      trialOn: day,
      trialShots,
      shotReading: Number(tool.shotCount) + trialShots,
      firstArticle: items.map((item, n) => ({ itemId: item.id, ...firstArticle[n]! })),
    };
  }
  if (step.action === 'approve' && r.irreversible) {
    // The demo brand lead confirms like anyone else: every ended product, the tool code, the password.
    const tool = (await ToolModel.findByPk(r.toolId, { attributes: ['code'], transaction }))!;
    input.password = DEMO_PASSWORD;
    input.typedToolCode = tool.code;
    input.confirmedProductIds = [...r.endedProductIds];
  }
  return input;
}
