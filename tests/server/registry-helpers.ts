// Rows for the registry API tests, written straight through the models (each test makes its own).
import { ratedLifeFromClass } from '../../shared/domain/tool-life';
import type { Construction, ProductStatus, ToolStatus } from '../../shared/schemas/registry';
import { BillOfPartsModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../../server/models';
import { uid } from './helpers';

export const code = (prefix = 'T') => `${prefix}-${uid().toUpperCase()}`;

export interface ToolOpts {
  brandId: string;
  factoryId: string;
  code?: string;
  name?: string;
  construction?: Construction;
  moldClass?: number;
  ratedShots?: number;
  shotCount?: number;
  cavityCount?: number;
  weightKg?: number | null;
  buildDate?: string | null;
  lastRunDate?: string | null;
  status?: ToolStatus;
  currentRevision?: number;
}

export async function makeTool(o: ToolOpts) {
  const moldClass = o.moldClass ?? 103;
  const life = ratedLifeFromClass(moldClass)!;
  const currentRevision = o.currentRevision ?? 1;
  const tool = await ToolModel.create({
    code: o.code ?? code(),
    name: o.name ?? `Tool ${uid()}`,
    brandId: o.brandId,
    factoryId: o.factoryId,
    construction: o.construction ?? 'pre_hardened_steel',
    moldClass,
    ratedShots: o.ratedShots ?? life.ratedShots,
    ratedShotsSource: o.ratedShots ? 'Mold maker quotation' : life.source,
    cavityCount: o.cavityCount ?? 4,
    weightKg: o.weightKg === undefined ? 300 : o.weightKg,
    buildCostCents: 1_500_000,
    currency: 'USD',
    buildDate: o.buildDate === undefined ? '2020-01-15' : o.buildDate,
    shotCount: o.shotCount ?? 1000,
    lastRunDate: o.lastRunDate === undefined ? null : o.lastRunDate,
    status: o.status ?? 'active',
    storageLocation: 'Rack 1',
    currentRevision,
  });
  for (let n = 1; n <= currentRevision; n++) {
    await ToolRevisionModel.create({ toolId: tool.id, number: n, madeOn: '2020-01-15', changeRequestId: null, note: n === 1 ? 'As built' : `Change ${n}` });
  }
  return tool;
}

export async function makePart(toolId: string, name = `Part ${uid()}`, cavitiesPerShot = 1, resin = 'ABS') {
  return PartModel.create({ toolId, name, resin, cavitiesPerShot });
}

export async function makeProduct(brandId: string, o: { sku?: string; name?: string; status?: ProductStatus } = {}) {
  return ProductModel.create({
    sku: o.sku ?? code('P'),
    name: o.name ?? `Product ${uid()}`,
    brandId,
    status: o.status ?? 'in_line',
    fobCents: 300,
    wholesaleCents: 650,
    retailCents: 1299,
    currency: 'USD',
    plannedUnits: 1000,
  });
}

export async function bind(productId: string, part: PartModel, revision: number, quantityPerUnit = 1) {
  return BillOfPartsModel.create({ productId, partId: part.id, toolId: part.toolId, revision, quantityPerUnit });
}
