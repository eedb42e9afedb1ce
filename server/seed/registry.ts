// Demo tool registry for Kestrel Bay Toy Co. (invented): a dozen tools across both brands and both
// factories, their parts, revisions and products in every status. Includes the demo scenario's head
// tool of "Ranger Kite" (reissue planned) and its derivative "Storm Kite", a tool past 80 % of its
// rated life, a tool due for a keep-or-scrap decision, a kept tool and a scrapped (disposed) one.
// Idempotent: finds every row by its natural key and leaves existing rows as they are.
import { addDays, format, subYears } from 'date-fns';
import type { Transaction } from 'sequelize';
import { ratedLifeFromClass } from '../../shared/domain/tool-life';
import type { Construction, ProductStatus, ToolStatus } from '../../shared/schemas/registry';
import { BillOfPartsModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../models';
import type { seedOrganisation } from './organisation';

type Org = Awaited<ReturnType<typeof seedOrganisation>>;

const HARBOURLINE = 'Harbourline Plastics';
const PEARL_DELTA = 'Pearl Delta Moldworks';
const ENGINEER = 'engineer@kestrelbay.example';

const day = (d: Date) => format(d, 'yyyy-MM-dd');
const today = () => new Date();
const daysAgo = (n: number) => day(addDays(today(), -n));
/** A last run this many days short of the retention period (3 years by default). */
const dueInDays = (n: number, years = 3) => day(addDays(subYears(today(), years), n));

interface SeedTool {
  code: string;
  name: string;
  brand: 'SR' | 'MR';
  factory: string;
  construction: Construction;
  moldClass: 101 | 102 | 103 | 104 | 105;
  rated?: { shots: number; source: string };
  cavityCount: number;
  weightKg: number;
  buildCostCents: number;
  buildDate: string;
  shotCount: number;
  lastRunDate: string | null;
  status: ToolStatus;
  storageLocation: string;
  parts: { name: string; resin: string; cavitiesPerShot: number }[];
  /** Revisions after 1 ("as built"). */
  revisions?: { number: number; madeOn: string; note: string }[];
  decision?: { decision: 'keep_until' | 'scrap' | 'sell'; keepUntil: string | null; decidedAt: string; note: string };
}

const tools: SeedTool[] = [
  {
    code: 'KB-T-0412',
    name: 'Ranger Kite head',
    brand: 'SR',
    factory: HARBOURLINE,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    cavityCount: 4,
    weightKg: 380,
    buildCostCents: 1_850_000,
    buildDate: '2021-03-15',
    shotCount: 212_400,
    lastRunDate: daysAgo(41),
    status: 'active',
    storageLocation: 'Harbourline bay C, rack 4',
    parts: [
      { name: 'Head', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Visor', resin: 'PC', cavitiesPerShot: 2 },
    ],
  },
  {
    code: 'KB-T-0413',
    name: 'Ranger 5-inch body',
    brand: 'SR',
    factory: HARBOURLINE,
    construction: 'hardened_steel',
    moldClass: 102,
    cavityCount: 8,
    weightKg: 920,
    buildCostCents: 4_200_000,
    buildDate: '2019-06-03',
    shotCount: 486_000,
    lastRunDate: daysAgo(41),
    status: 'active',
    storageLocation: 'Harbourline bay C, rack 1',
    parts: [
      { name: 'Torso front', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Torso back', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Arm pair', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Leg pair', resin: 'POM', cavitiesPerShot: 2 },
    ],
    revisions: [{ number: 2, madeOn: '2022-08-19', note: 'Leg pegs thickened by 0.4 mm after use-and-abuse torque failures on the first run.' }],
  },
  {
    code: 'KB-T-0420',
    name: 'Ranger Osprey head and wings',
    brand: 'SR',
    factory: PEARL_DELTA,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    cavityCount: 4,
    weightKg: 410,
    buildCostCents: 2_260_000,
    buildDate: '2019-11-20',
    shotCount: 431_250,
    lastRunDate: daysAgo(12),
    status: 'active',
    storageLocation: 'Pearl Delta press hall 2',
    parts: [
      { name: 'Head', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Wing pair', resin: 'PP', cavitiesPerShot: 2 },
    ],
  },
  {
    code: 'KB-T-0431',
    name: 'Ranger accessory tree',
    brand: 'SR',
    factory: PEARL_DELTA,
    construction: 'aluminium',
    moldClass: 104,
    cavityCount: 6,
    weightKg: 140,
    buildCostCents: 780_000,
    buildDate: '2023-02-10',
    shotCount: 64_800,
    lastRunDate: daysAgo(75),
    status: 'idle',
    storageLocation: 'Pearl Delta store A-12',
    parts: [
      { name: 'Glider wing', resin: 'PP', cavitiesPerShot: 2 },
      { name: 'Signal blaster', resin: 'ABS', cavitiesPerShot: 2 },
      { name: 'Display stand', resin: 'ABS', cavitiesPerShot: 2 },
    ],
  },
  {
    code: 'KB-T-0388',
    name: 'Ranger Heron head',
    brand: 'SR',
    factory: HARBOURLINE,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    cavityCount: 2,
    weightKg: 260,
    buildCostCents: 1_540_000,
    buildDate: '2018-04-02',
    shotCount: 188_000,
    lastRunDate: dueInDays(45),
    status: 'idle',
    storageLocation: 'Harbourline store B-07',
    parts: [{ name: 'Head', resin: 'ABS', cavitiesPerShot: 2 }],
  },
  {
    code: 'KB-T-0301',
    name: 'Ranger Lark head',
    brand: 'SR',
    factory: PEARL_DELTA,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    cavityCount: 2,
    weightKg: 240,
    buildCostCents: 1_380_000,
    buildDate: '2016-05-11',
    shotCount: 302_500,
    lastRunDate: '2020-09-14',
    status: 'disposed',
    storageLocation: 'Scrapped at Pearl Delta',
    parts: [{ name: 'Head', resin: 'ABS', cavitiesPerShot: 2 }],
    decision: {
      decision: 'scrap',
      keepUntil: null,
      decidedAt: '2023-10-02T09:30:00Z',
      note: 'Figure retired in 2020 with no reissue planned; storage fees exceed any resale value.',
    },
  },
  {
    code: 'KB-T-0510',
    name: 'Dune Buggy chassis',
    brand: 'MR',
    factory: PEARL_DELTA,
    construction: 'hardened_steel',
    moldClass: 101,
    cavityCount: 1,
    weightKg: 1250,
    buildCostCents: 9_600_000,
    buildDate: '2022-01-17',
    shotCount: 312_000,
    lastRunDate: daysAgo(20),
    status: 'active',
    storageLocation: 'Pearl Delta press hall 1',
    parts: [{ name: 'Chassis', resin: 'PP', cavitiesPerShot: 1 }],
  },
  {
    code: 'KB-T-0511',
    name: 'Dune Buggy body shell',
    brand: 'MR',
    factory: PEARL_DELTA,
    construction: 'hardened_steel',
    moldClass: 102,
    cavityCount: 2,
    weightKg: 1480,
    buildCostCents: 11_250_000,
    buildDate: '2022-01-24',
    shotCount: 298_400,
    lastRunDate: daysAgo(20),
    status: 'active',
    storageLocation: 'Pearl Delta press hall 1',
    parts: [
      { name: 'Body shell', resin: 'ABS', cavitiesPerShot: 1 },
      { name: 'Roll cage', resin: 'ABS', cavitiesPerShot: 1 },
    ],
  },
  {
    code: 'KB-T-0512',
    name: 'Racer wheel and tyre set',
    brand: 'MR',
    factory: HARBOURLINE,
    construction: 'stainless',
    moldClass: 102,
    cavityCount: 8,
    weightKg: 690,
    buildCostCents: 3_900_000,
    buildDate: '2020-07-08',
    shotCount: 610_000,
    lastRunDate: daysAgo(33),
    status: 'active',
    storageLocation: 'Harbourline bay A, rack 2',
    parts: [
      { name: 'Wheel hub', resin: 'ABS', cavitiesPerShot: 4 },
      { name: 'Tyre', resin: 'PVC (flexible)', cavitiesPerShot: 4 },
    ],
  },
  {
    code: 'KB-T-0520',
    name: 'Rock Crawler body',
    brand: 'MR',
    factory: HARBOURLINE,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    cavityCount: 2,
    weightKg: 1120,
    buildCostCents: 7_400_000,
    buildDate: '2021-09-30',
    shotCount: 145_000,
    lastRunDate: daysAgo(210),
    status: 'idle',
    storageLocation: 'Harbourline store B-02',
    parts: [
      { name: 'Body', resin: 'ABS', cavitiesPerShot: 1 },
      { name: 'Bull bar', resin: 'ABS', cavitiesPerShot: 1 },
    ],
  },
  {
    code: 'KB-T-0530',
    name: 'Rear spoiler (prototype)',
    brand: 'MR',
    factory: HARBOURLINE,
    construction: 'aluminium',
    moldClass: 105,
    cavityCount: 1,
    weightKg: 38,
    buildCostCents: 420_000,
    buildDate: '2025-03-04',
    shotCount: 520,
    lastRunDate: daysAgo(160),
    status: 'idle',
    storageLocation: 'Harbourline sample room',
    parts: [{ name: 'Spoiler', resin: 'ABS', cavitiesPerShot: 1 }],
  },
  {
    code: 'KB-T-0490',
    name: 'Swamp Runner body',
    brand: 'MR',
    factory: PEARL_DELTA,
    construction: 'pre_hardened_steel',
    moldClass: 103,
    rated: { shots: 400_000, source: 'Pearl Delta Moldworks tool quotation PD-Q-2017-118 (guaranteed 400,000 shots)' },
    cavityCount: 2,
    weightKg: 1050,
    buildCostCents: 6_900_000,
    buildDate: '2017-08-21',
    shotCount: 268_000,
    lastRunDate: dueInDays(-160),
    status: 'retained',
    storageLocation: 'Pearl Delta store C-03',
    parts: [
      { name: 'Body', resin: 'ABS', cavitiesPerShot: 1 },
      { name: 'Snorkel', resin: 'PP', cavitiesPerShot: 1 },
    ],
    decision: {
      decision: 'keep_until',
      keepUntil: day(addDays(today(), 300)),
      decidedAt: daysAgo(150) + 'T08:00:00Z',
      note: 'Keep for a possible 25th-anniversary reissue; decide after the next line review.',
    },
  },
];

interface SeedProduct {
  sku: string;
  name: string;
  brand: 'SR' | 'MR';
  status: ProductStatus;
  fobCents: number;
  wholesaleCents: number;
  retailCents: number;
  plannedUnits: number;
  /** [tool code, part name, revision, quantity per unit]; revision null = the tool's current one. */
  bill: [string, string, number | null, number][];
}

const body = (rev: number | null): SeedProduct['bill'] => [
  ['KB-T-0413', 'Torso front', rev, 1],
  ['KB-T-0413', 'Torso back', rev, 1],
  ['KB-T-0413', 'Arm pair', rev, 1],
  ['KB-T-0413', 'Leg pair', rev, 1],
];

const products: SeedProduct[] = [
  {
    sku: 'SR-1001',
    name: 'Ranger Kite',
    brand: 'SR',
    status: 'reissue_planned',
    fobCents: 310,
    wholesaleCents: 650,
    retailCents: 1299,
    plannedUnits: 40_000,
    bill: [['KB-T-0412', 'Head', null, 1], ['KB-T-0412', 'Visor', null, 1], ...body(null), ['KB-T-0431', 'Glider wing', null, 1]],
  },
  {
    sku: 'SR-1002',
    name: 'Storm Kite',
    brand: 'SR',
    status: 'in_line',
    fobCents: 325,
    wholesaleCents: 680,
    retailCents: 1399,
    plannedUnits: 60_000,
    // The head with the raised visor ridge does not exist yet: only the shared body is listed.
    bill: [...body(null), ['KB-T-0431', 'Signal blaster', null, 1]],
  },
  {
    sku: 'SR-1003',
    name: 'Ranger Osprey',
    brand: 'SR',
    status: 'in_line',
    fobCents: 335,
    wholesaleCents: 690,
    retailCents: 1399,
    plannedUnits: 55_000,
    bill: [['KB-T-0420', 'Head', null, 1], ['KB-T-0420', 'Wing pair', null, 1], ...body(null), ['KB-T-0431', 'Display stand', null, 1]],
  },
  {
    sku: 'SR-0950',
    name: 'Ranger Heron',
    brand: 'SR',
    status: 'retired',
    fobCents: 290,
    wholesaleCents: 600,
    retailCents: 1199,
    plannedUnits: 0,
    bill: [['KB-T-0388', 'Head', null, 1], ...body(1)],
  },
  {
    sku: 'SR-0801',
    name: 'Ranger Lark',
    brand: 'SR',
    status: 'retired',
    fobCents: 270,
    wholesaleCents: 560,
    retailCents: 1099,
    plannedUnits: 0,
    bill: [['KB-T-0301', 'Head', null, 1], ...body(1)],
  },
  {
    sku: 'MR-2001',
    name: 'Mudlark Dune Buggy',
    brand: 'MR',
    status: 'in_line',
    fobCents: 1150,
    wholesaleCents: 2400,
    retailCents: 4499,
    plannedUnits: 30_000,
    bill: [
      ['KB-T-0510', 'Chassis', null, 1],
      ['KB-T-0511', 'Body shell', null, 1],
      ['KB-T-0511', 'Roll cage', null, 1],
      ['KB-T-0512', 'Wheel hub', null, 4],
      ['KB-T-0512', 'Tyre', null, 4],
    ],
  },
  {
    sku: 'MR-2002',
    name: 'Mudlark Rock Crawler',
    brand: 'MR',
    status: 'reissue_planned',
    fobCents: 1280,
    wholesaleCents: 2650,
    retailCents: 4999,
    plannedUnits: 18_000,
    bill: [
      ['KB-T-0520', 'Body', null, 1],
      ['KB-T-0520', 'Bull bar', null, 1],
      ['KB-T-0510', 'Chassis', null, 1],
      ['KB-T-0512', 'Wheel hub', null, 4],
      ['KB-T-0512', 'Tyre', null, 4],
    ],
  },
  {
    sku: 'MR-1900',
    name: 'Mudlark Swamp Runner',
    brand: 'MR',
    status: 'retired',
    fobCents: 1090,
    wholesaleCents: 2250,
    retailCents: 3999,
    plannedUnits: 0,
    bill: [
      ['KB-T-0490', 'Body', null, 1],
      ['KB-T-0490', 'Snorkel', null, 1],
      ['KB-T-0512', 'Wheel hub', null, 4],
      ['KB-T-0512', 'Tyre', null, 4],
    ],
  },
  {
    sku: 'MR-2101',
    name: 'Mudlark Dune Buggy Turbo (sample run)',
    brand: 'MR',
    status: 'in_line',
    fobCents: 1240,
    wholesaleCents: 2600,
    retailCents: 4799,
    plannedUnits: 2_000,
    bill: [
      ['KB-T-0510', 'Chassis', null, 1],
      ['KB-T-0511', 'Body shell', null, 1],
      ['KB-T-0530', 'Spoiler', null, 1],
      ['KB-T-0512', 'Wheel hub', null, 4],
      ['KB-T-0512', 'Tyre', null, 4],
    ],
  },
];

export async function seedRegistry(transaction: Transaction, org: Org) {
  const engineer = org.users.get(ENGINEER);
  const toolRows = new Map<string, ToolModel>();
  const partRows = new Map<string, PartModel>();

  for (const t of tools) {
    let row = await ToolModel.findOne({ where: { code: t.code }, transaction });
    if (!row) {
      const rated = t.rated ? { ratedShots: t.rated.shots, ratedShotsSource: t.rated.source } : fromClass(t.moldClass);
      const lastRevision = Math.max(1, ...(t.revisions ?? []).map((r) => r.number));
      row = await ToolModel.create(
        {
          code: t.code,
          name: t.name,
          brandId: org.brands.get(t.brand)!.id,
          factoryId: org.factories.get(t.factory)!.id,
          construction: t.construction,
          moldClass: t.moldClass,
          ...rated,
          cavityCount: t.cavityCount,
          weightKg: t.weightKg,
          buildCostCents: t.buildCostCents,
          currency: 'USD',
          buildDate: t.buildDate,
          shotCount: t.shotCount,
          lastRunDate: t.lastRunDate,
          status: t.status,
          storageLocation: t.storageLocation,
          currentRevision: lastRevision,
          retentionDecision: t.decision?.decision ?? null,
          retentionKeepUntil: t.decision?.keepUntil ?? null,
          retentionDecidedBy: t.decision ? (engineer?.id ?? null) : null,
          retentionDecidedAt: t.decision ? new Date(t.decision.decidedAt) : null,
          retentionNote: t.decision?.note ?? null,
        },
        { transaction },
      );
    }
    toolRows.set(t.code, row);
    const revisions = [{ number: 1, madeOn: t.buildDate, note: 'As built' }, ...(t.revisions ?? [])];
    for (const r of revisions) {
      await ToolRevisionModel.findOrCreate({
        where: { toolId: row.id, number: r.number },
        defaults: { toolId: row.id, number: r.number, madeOn: r.madeOn, changeRequestId: null, note: r.note },
        transaction,
      });
    }
    for (const p of t.parts) {
      const [part] = await PartModel.findOrCreate({ where: { toolId: row.id, name: p.name }, defaults: { toolId: row.id, ...p }, transaction });
      partRows.set(`${t.code}/${p.name}`, part);
    }
  }

  for (const p of products) {
    const [product] = await ProductModel.findOrCreate({
      where: { sku: p.sku },
      defaults: {
        sku: p.sku,
        name: p.name,
        brandId: org.brands.get(p.brand)!.id,
        status: p.status,
        fobCents: p.fobCents,
        wholesaleCents: p.wholesaleCents,
        retailCents: p.retailCents,
        currency: 'USD',
        plannedUnits: p.plannedUnits,
      },
      transaction,
    });
    for (const [code, partName, revision, quantityPerUnit] of p.bill) {
      const tool = toolRows.get(code)!;
      const part = partRows.get(`${code}/${partName}`)!;
      await BillOfPartsModel.findOrCreate({
        where: { productId: product.id, partId: part.id },
        defaults: { productId: product.id, partId: part.id, toolId: tool.id, revision: revision ?? tool.currentRevision, quantityPerUnit },
        transaction,
      });
    }
  }
  return { tools: toolRows, parts: partRows };
}

function fromClass(moldClass: number) {
  const life = ratedLifeFromClass(moldClass);
  if (!life) throw new Error(`Mold class ${moldClass} has no published rated life: give the seed tool its own figure`);
  return { ratedShots: life.ratedShots, ratedShotsSource: life.source };
}
