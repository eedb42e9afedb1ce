// Demo numbers (invented) for the demo head re-cut (KB-T-0412, raised visor ridge for Storm Kite,
// in engineering review): the tooling engineer's estimate and plan, so the request's numbers card
// and the tool's "life versus open plans" have figures. Prices and planned units come from the
// Storm Kite product; only freight, duty and scrap are entered here. Idempotent: a request that
// already has an estimate or plan inputs is left as it is.
import type { Transaction } from 'sequelize';
import { numbersInputsSchema, type NumbersInputsInput } from '../../shared/schemas/numbers';
import { ChangeRequestModel, ToolModel, UserModel } from '../models';
import { recordAudit } from '../services/audit';

const ENGINEER = 'engineer@kestrelbay.example';

interface SeedNumbers {
  toolCode: string;
  title: string;
  inputs: NumbersInputsInput;
}

export const demoNumbers: SeedNumbers[] = [
  {
    toolCode: 'KB-T-0412',
    title: 'Raised visor ridge on the Kite head for Storm Kite',
    inputs: {
      estimate: {
        modificationCostCents: 680_000,
        leadDays: 28,
        trialRoundsExpected: 2,
        newInsertCents: 1_450_000,
        duplicateToolCents: 2_100_000,
      },
      plan: {
        // Planned units, FOB, wholesale and retail: from SR-1002 Storm Kite.
        plannedUnits: null,
        // Storm Kite's bill of parts does not list the new head yet: one head per figure.
        partsPerUnit: 1,
        scrapRate: '0.03',
        fobCents: null,
        freightPerUnitCents: 22,
        dutyPercent: '0',
        wholesaleCents: null,
        retailCents: null,
        currency: null,
      },
      // Height over the brow grows 0.8 mm with the ridge; the ridge is formed by a pocket cut in the cavity.
      dimension: { oldPartMm: '31.2', newPartMm: '32.0', resinId: 'abs', shrink: null, convention: 'astm_d955', formedBy: 'recess' },
      // Two head cavities plus runner on the parting plane, a little larger with the ridge.
      clamp: {
        projectedArea: '41.5',
        areaUnit: 'cm2',
        factorId: 'ji_horng_abs',
        factor: null,
        safetyFactor: '1.1',
        pressTonnage: '90',
        pressUnit: 'short_tons',
      },
    },
  },
];

export async function seedNumbers(transaction: Transaction) {
  const engineer = await UserModel.findOne({ where: { email: ENGINEER }, transaction });
  if (!engineer) throw new Error(`Seed user ${ENGINEER} is missing`);
  for (const spec of demoNumbers) {
    const tool = await ToolModel.findOne({ where: { code: spec.toolCode }, attributes: ['id'], transaction });
    if (!tool) throw new Error(`Seed tool ${spec.toolCode} is missing`);
    const request = await ChangeRequestModel.findOne({ where: { title: spec.title, toolId: tool.id }, transaction });
    if (!request) throw new Error(`Seed request "${spec.title}" is missing`);
    if (request.estimate !== null || request.numbersInputs !== null) continue;
    const inputs = numbersInputsSchema.parse(spec.inputs);
    const after = { estimate: inputs.estimate, numbersInputs: { plan: inputs.plan, dimension: inputs.dimension, clamp: inputs.clamp } };
    request.set(after);
    await request.save({ transaction });
    await recordAudit(transaction, { id: engineer.id, name: engineer.name }, 'change_request.numbers', 'change_request', request.id, { estimate: null, numbersInputs: null }, after);
  }
}
