// Products and their bill of parts: list and search, detail ("can it still be made, and from
// which tools?"), create and edit.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { lineBlocker } from '../../shared/domain/makeability';
import { toolLife } from '../../shared/domain/tool-life';
import type {
  BillEntry,
  CreateProductValues,
  ProductDetail,
  ProductListResponse,
  UpdateProductValues,
  listProductsQuery,
} from '../../shared/schemas/registry';
import type { z } from 'zod';
import type { Actor } from '../lib/auth';
import { AppError, notFound } from '../lib/errors';
import { BillOfPartsModel, BrandModel, FactoryModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../models';
import { recordAudit } from './audit';
import { assertEditable, containsPattern, decodeCursor, encodeCursor, iso, productAuditRecord, scopeOf, staleVersion, toProductDto, type Scope } from './registry-common';
import { billStatesFor } from './tools';

const withBrand = [{ model: BrandModel, as: 'brand', attributes: ['id', 'code', 'name'] }];

function productWhere(scope: Scope, f: z.output<typeof listProductsQuery>) {
  const clauses: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (scope.factoryId) {
    // Toolmakers see the products that depend on a tool of their own factory.
    clauses.push('EXISTS (SELECT 1 FROM bill_of_parts b JOIN tools t ON t.id = b.tool_id WHERE b.product_id = pr.id AND t.factory_id = :scopeFactoryId)');
    replacements.scopeFactoryId = scope.factoryId;
  }
  if (f.q) {
    replacements.q = containsPattern(f.q);
    const visibleTool = scope.factoryId ? 'AND t.factory_id = :scopeFactoryId' : '';
    clauses.push(`(pr.sku ILIKE :q OR pr.name ILIKE :q
      OR EXISTS (SELECT 1 FROM bill_of_parts b JOIN tools t ON t.id = b.tool_id WHERE b.product_id = pr.id AND t.code ILIKE :q ${visibleTool}))`);
  }
  if (f.brandId) {
    clauses.push('pr.brand_id = :brandId');
    replacements.brandId = f.brandId;
  }
  if (f.status) {
    clauses.push('pr.status = :status');
    replacements.status = f.status;
  }
  if (f.toolId) {
    clauses.push('EXISTS (SELECT 1 FROM bill_of_parts b WHERE b.product_id = pr.id AND b.tool_id = :toolId)');
    replacements.toolId = f.toolId;
  }
  return { sql: clauses.length ? clauses.join(' AND ') : 'true', replacements };
}

export async function listProducts(sequelize: Sequelize, actor: Actor, f: z.output<typeof listProductsQuery>): Promise<ProductListResponse> {
  const scope = scopeOf(actor);
  const { sql, replacements } = productWhere(scope, f);
  const after = decodeCursor(f.cursor);
  const rows = await sequelize.query<{ id: string; sku: string }>(
    `SELECT pr.id, pr.sku FROM products pr WHERE ${sql} ${after !== undefined ? 'AND pr.sku > :after' : ''} ORDER BY pr.sku ASC LIMIT :limit`,
    { type: QueryTypes.SELECT, replacements: { ...replacements, after, limit: f.limit + 1 } },
  );
  const page = rows.slice(0, f.limit);
  const ids = page.map((r) => r.id);
  const products = ids.length ? await ProductModel.findAll({ where: { id: ids }, include: withBrand }) : [];
  const byId = new Map(products.map((p) => [p.id, p]));
  const makeability = await billStatesFor(ids, scope);
  const lines = ids.length
    ? await BillOfPartsModel.findAll({ where: { productId: ids }, include: [{ model: ToolModel, as: 'tool', attributes: ['code', 'factoryId'] }] })
    : [];
  const codes = new Map<string, Set<string>>();
  for (const l of lines) {
    if (scope.factoryId && l.tool!.factoryId !== scope.factoryId) continue;
    codes.set(l.productId, (codes.get(l.productId) ?? new Set()).add(l.tool!.code));
  }
  return {
    data: ids.map((id) => {
      const p = byId.get(id)!;
      return { ...toProductDto(p), canBeMade: makeability(id).canBeMade, toolCodes: [...(codes.get(id) ?? [])].sort() };
    }),
    meta: { nextCursor: rows.length > f.limit ? encodeCursor(page[page.length - 1]!.sku) : null },
  };
}

export async function getProductDetail(actor: Actor, id: string): Promise<ProductDetail> {
  const scope = scopeOf(actor);
  const product = await ProductModel.findByPk(id, { include: withBrand });
  if (!product) throw notFound('Product');
  const lines = await BillOfPartsModel.findAll({
    where: { productId: id },
    include: [
      { model: PartModel, as: 'part', attributes: ['id', 'name', 'resin', 'cavitiesPerShot'] },
      {
        model: ToolModel,
        as: 'tool',
        attributes: ['id', 'code', 'name', 'status', 'currentRevision', 'shotCount', 'ratedShots', 'factoryId'],
        include: [{ model: FactoryModel, as: 'factory', attributes: ['id', 'name'] }],
      },
    ],
  });
  const visible = lines.filter((l) => scope.factoryId === null || l.tool!.factoryId === scope.factoryId);
  if (scope.factoryId && visible.length === 0) throw notFound('Product');
  const makeability = (await billStatesFor([id], scope))(id);

  const bill = visible
    .map((l) => {
      const t = l.tool!;
      const blocker = lineBlocker({ partName: l.part!.name, toolCode: t.code, toolStatus: t.status, toolCurrentRevision: t.currentRevision, revision: l.revision });
      return {
        id: l.id,
        revision: l.revision,
        quantityPerUnit: l.quantityPerUnit,
        part: { id: l.part!.id, name: l.part!.name, resin: l.part!.resin, cavitiesPerShot: l.part!.cavitiesPerShot },
        tool: {
          id: t.id,
          code: t.code,
          name: t.name,
          status: t.status,
          currentRevision: t.currentRevision,
          factory: { id: t.factory!.id, name: t.factory!.name },
          life: toolLife({ ratedShots: t.ratedShots, shotCount: t.shotCount }),
        },
        moldable: blocker === null,
        problem: blocker?.message ?? null,
      };
    })
    .sort((a, b) => a.tool.code.localeCompare(b.tool.code) || a.part.name.localeCompare(b.part.name));

  const tools = new Map<string, ProductDetail['tools'][number]>();
  for (const line of bill) {
    const entry = tools.get(line.tool.id) ?? {
      id: line.tool.id,
      code: line.tool.code,
      name: line.tool.name,
      status: line.tool.status,
      currentRevision: line.tool.currentRevision,
      revisionsNeeded: [],
    };
    if (!entry.revisionsNeeded.includes(line.revision)) entry.revisionsNeeded.push(line.revision);
    entry.revisionsNeeded.sort((a, b) => a - b);
    tools.set(line.tool.id, entry);
  }
  return { ...toProductDto(product), bill, tools: [...tools.values()], makeability, hiddenLines: lines.length - visible.length };
}

async function checkBrand(brandId: string | undefined, transaction?: Transaction) {
  if (brandId && !(await BrandModel.findByPk(brandId, { transaction }))) {
    throw new AppError('validation_failed', 'Pick an existing brand', 400, { brandId: ['Unknown brand'] });
  }
}

async function checkSkuFree(sku: string, exceptId?: string, transaction?: Transaction) {
  const clash = await ProductModel.findOne({ where: { sku }, attributes: ['id'], transaction });
  if (clash && clash.id !== exceptId) throw new AppError('conflict', `A product with SKU ${sku} already exists`, 409, { sku: ['Already in use'] });
}

const productAudit = productAuditRecord;

export async function createProduct(sequelize: Sequelize, actor: Actor, input: CreateProductValues) {
  await checkBrand(input.brandId);
  await checkSkuFree(input.sku);
  return sequelize.transaction(async (transaction) => {
    const p = await ProductModel.create(input, { transaction });
    await p.reload({ include: withBrand, transaction });
    await recordAudit(transaction, actor, 'product.create', 'product', p.id, null, productAudit(p));
    return toProductDto(p);
  });
}

export async function updateProduct(sequelize: Sequelize, actor: Actor, id: string, input: UpdateProductValues) {
  await checkBrand(input.brandId);
  return sequelize.transaction(async (transaction) => {
    const p = await ProductModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!p) throw notFound('Product');
    await p.reload({ include: withBrand, transaction });
    if (input.version !== p.version) throw staleVersion('product', toProductDto(p));
    if (input.sku !== undefined) await checkSkuFree(input.sku, id, transaction);
    const { version: _v, ...changes } = input;
    const wholesale = changes.wholesaleCents !== undefined ? changes.wholesaleCents : p.wholesaleCents;
    const retail = changes.retailCents !== undefined ? changes.retailCents : p.retailCents;
    if (wholesale != null && retail != null && retail < wholesale) {
      throw new AppError('validation_failed', 'Retail price is below the wholesale price', 400, { retailCents: ['Below the wholesale price'] });
    }
    const before = productAudit(p);
    p.set(changes as Partial<ProductModel>);
    if (!p.changed()) return toProductDto(p);
    await p.save({ transaction });
    await p.reload({ include: withBrand, transaction });
    await recordAudit(transaction, actor, 'product.update', 'product', p.id, before, productAudit(p));
    return toProductDto(p);
  });
}

// ---------------------------------------------------------------------------------------------
// Bill of parts

export const toBillEntryDto = (b: BillOfPartsModel): BillEntry => ({
  id: b.id,
  productId: b.productId,
  partId: b.partId,
  toolId: b.toolId,
  revision: b.revision,
  quantityPerUnit: b.quantityPerUnit,
  createdAt: iso(b.createdAt),
  updatedAt: iso(b.updatedAt),
});

async function checkRevision(tool: ToolModel, revision: number, transaction: Transaction) {
  const exists = await ToolRevisionModel.findOne({ where: { toolId: tool.id, number: revision }, attributes: ['id'], transaction });
  if (!exists) {
    throw new AppError('validation_failed', `Tool ${tool.code} has no revision ${revision} (it is at revision ${tool.currentRevision})`, 400, {
      revision: [`Pick a revision from 1 to ${tool.currentRevision}`],
    });
  }
}

export async function createBillEntry(
  sequelize: Sequelize,
  actor: Actor,
  productId: string,
  input: { partId: string; revision?: number; quantityPerUnit: number },
) {
  return sequelize.transaction(async (transaction) => {
    const product = await ProductModel.findByPk(productId, { transaction, attributes: ['id', 'sku'] });
    if (!product) throw notFound('Product');
    const part = await PartModel.findByPk(input.partId, { transaction, include: [{ model: ToolModel, as: 'tool' }] });
    if (!part) throw new AppError('validation_failed', 'That part does not exist', 400, { partId: ['Unknown part'] });
    const tool = part.tool!;
    if (tool.status === 'disposed') {
      throw new AppError('wrong_state', `Tool ${tool.code} is disposed: no product can be newly bound to its parts`, 409);
    }
    const revision = input.revision ?? tool.currentRevision;
    await checkRevision(tool, revision, transaction);
    if (await BillOfPartsModel.findOne({ where: { productId, partId: part.id }, attributes: ['id'], transaction })) {
      throw new AppError('conflict', `Product ${product.sku} already lists part "${part.name}" of tool ${tool.code}: edit that line instead`, 409, {
        partId: ['Already on this bill'],
      });
    }
    const entry = await BillOfPartsModel.create({ productId, partId: part.id, toolId: tool.id, revision, quantityPerUnit: input.quantityPerUnit }, { transaction });
    await recordAudit(transaction, actor, 'bill_line.create', 'bill_line', entry.id, null, toBillEntryDto(entry));
    return toBillEntryDto(entry);
  });
}

async function findEntry(id: string, transaction: Transaction) {
  const entry = await BillOfPartsModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!entry) throw notFound('Bill line');
  return entry;
}

export async function updateBillEntry(sequelize: Sequelize, actor: Actor, id: string, input: { revision?: number; quantityPerUnit?: number }) {
  return sequelize.transaction(async (transaction) => {
    const entry = await findEntry(id, transaction);
    const tool = (await ToolModel.findByPk(entry.toolId, { transaction }))!;
    if (input.revision !== undefined && input.revision !== entry.revision) {
      assertEditable(tool);
      await checkRevision(tool, input.revision, transaction);
    }
    const before = toBillEntryDto(entry);
    entry.set(input);
    if (!entry.changed()) return before;
    await entry.save({ transaction });
    await recordAudit(transaction, actor, 'bill_line.update', 'bill_line', entry.id, before, toBillEntryDto(entry));
    return toBillEntryDto(entry);
  });
}

export async function deleteBillEntry(sequelize: Sequelize, actor: Actor, id: string) {
  await sequelize.transaction(async (transaction) => {
    const entry = await findEntry(id, transaction);
    const before = toBillEntryDto(entry);
    await entry.destroy({ transaction });
    await recordAudit(transaction, actor, 'bill_line.delete', 'bill_line', id, before, null);
  });
}
