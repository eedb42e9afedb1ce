// CSV import (tools, parts, products, bill lines; one kind per file) and the tool-list export.
//
// Import: the file is checked row by row first. A dry run returns the report and writes nothing.
// A real run writes every row in ONE transaction, and only when no row has an error: otherwise it
// answers 400 with the same report and nothing is written. Rows whose key exists update the
// record (tools by code, parts by tool code + part name, products by SKU, bill lines by SKU +
// tool code + part name); disposed tools are read-only and refuse updates.
import Papa from 'papaparse';
import type { Sequelize, Transaction } from 'sequelize';
import type { ZodType } from 'zod';
import { centsToDecimalString, parseCents } from '../../shared/domain/money';
import { ratedLifeFromClass } from '../../shared/domain/tool-life';
import {
  billCsvRow,
  csvColumnsOf,
  partCsvRow,
  productCsvRow,
  requiredCsvColumns,
  toolCsvExportOnlyColumns,
  toolCsvRow,
  type BillCsvRow,
  type ImportKind,
  type ImportReport,
  type ImportRow,
  type PartCsvRow,
  type ProductCsvRow,
  type Tool,
  type ToolCsvRow,
} from '../../shared/schemas/registry';
import { todayInZone } from '../../shared/domain/retention';
import type { Actor } from '../lib/auth';
import { AppError } from '../lib/errors';
import { unstorableText } from '../lib/text-guard';
import { changesHolding, holdingWords } from './tool-changes';
import { recordAudit, recordAudits, type AuditEntry } from './audit';
import { productAuditRecord, toolAuditRecord, toPartDto } from './registry-common';
import { BillOfPartsModel, BrandModel, FactoryModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../models';

export const MAX_IMPORT_ROWS = 5000;

const columnsOf: Record<ImportKind, readonly string[]> = { ...csvColumnsOf, tools: [...csvColumnsOf.tools, ...toolCsvExportOnlyColumns] };

type CellErrors = { column: string | null; message: string }[];

interface ParsedRow<T> {
  line: number;
  key: string;
  values?: T;
  errors: CellErrors;
}

/** Something to write: a create (values) or an update (the instance and its changes). */
type WriteOp<M> = { kind: 'create'; values: Record<string, unknown> } | { kind: 'update'; row: M; changes: Record<string, unknown> } | { kind: 'unchanged' };

interface Planned<M> extends ParsedRow<unknown> {
  op?: WriteOp<M>;
}

// Spreadsheet formula guard. The export puts an apostrophe before a cell that a spreadsheet would run
// as a formula (=, +, -, @, tab, carriage return), and before a cell that already starts with
// apostrophes and then such a character; the import takes exactly one such apostrophe off again, so
// exporting and importing a value gives back the same value.
const FORMULA_LIKE = /^'*[=+\-@\t\r]/;
const unguard = (v: string) => (v.startsWith("'") && FORMULA_LIKE.test(v) ? v.slice(1) : v);

function parseFile(csv: string, kind: ImportKind) {
  const text = csv.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<Record<string, string>>(text, {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
    transform: (v) => unguard(v),
  });
  const fileErrors: string[] = [];
  const headers = parsed.meta.fields ?? [];
  const known = new Set(columnsOf[kind]);
  const missing = requiredCsvColumns[kind].filter((c) => !headers.includes(c));
  if (missing.length) fileErrors.push(`Missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`);
  const unknown = headers.filter((h) => h !== '' && !known.has(h));
  if (unknown.length) fileErrors.push(`Unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')} (expected: ${columnsOf[kind].join(', ')})`);
  const dupes = headers.filter((h, i) => headers.indexOf(h) !== i);
  if (dupes.length) fileErrors.push(`Column given twice: ${[...new Set(dupes)].join(', ')}`);
  if (parsed.data.length === 0) fileErrors.push('The file has no data rows under its header');
  if (parsed.data.length > MAX_IMPORT_ROWS) fileErrors.push(`The file has ${parsed.data.length} rows; import at most ${MAX_IMPORT_ROWS} at a time`);
  const rowErrors = new Map<number, string[]>();
  for (const e of parsed.errors) {
    if (typeof e.row === 'number') rowErrors.set(e.row, [...(rowErrors.get(e.row) ?? []), e.message]);
    else fileErrors.push(e.message);
  }
  // Papa counts data rows from 0; the header is line 1. Lines are counted as rows (a quoted cell with
  // a line break still counts as one row).
  return { rows: parsed.data, fileErrors, rowErrors };
}

function validateRows<T>(rows: Record<string, string>[], rowErrors: Map<number, string[]>, schema: ZodType<T>, keyOf: (r: Record<string, string>) => string): ParsedRow<T>[] {
  return rows.map((raw, i) => {
    const line = i + 2;
    const errors: CellErrors = (rowErrors.get(i) ?? []).map((message) => ({ column: null, message }));
    const clean = Object.fromEntries(
      Object.entries(raw)
        .filter(([k]) => k !== '' && k !== '__parsed_extra')
        .map(([k, v]) => [k, typeof v === 'string' ? v.trim() : v]),
    );
    for (const [column, v] of Object.entries(clean)) {
      const why = typeof v === 'string' ? unstorableText(v) : null;
      if (why) errors.push({ column, message: why });
    }
    const result = schema.safeParse(clean);
    if (!result.success) {
      for (const issue of result.error.issues) errors.push({ column: issue.path.length ? String(issue.path[0]) : null, message: issue.message });
    }
    return { line, key: keyOf(raw), values: result.success && !errors.length ? result.data : undefined, errors };
  });
}

function markDuplicates(rows: ParsedRow<unknown>[], what: string) {
  const seen = new Map<string, number>();
  for (const r of rows) {
    const k = r.key.toUpperCase();
    const first = seen.get(k);
    if (first !== undefined) r.errors.push({ column: null, message: `${what} ${r.key} is also on line ${first}: give each once` });
    else seen.set(k, r.line);
  }
}

const trimKey = (v: string | undefined) => (v ?? '').trim();
const money = (text: string | undefined, currency: string, column: string, errors: CellErrors) => {
  if (text === undefined) return undefined;
  try {
    return parseCents(text, currency);
  } catch (e) {
    errors.push({ column, message: e instanceof Error ? e.message : 'Not an amount' });
    return undefined;
  }
};

/** Changes between the stored row and the new values (only the keys given). */
function diff(row: { get(key: string): unknown }, values: Record<string, unknown>) {
  const changes: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(values)) {
    if (v === undefined) continue;
    const current = row.get(k);
    const same =
      typeof current === 'string' && typeof v === 'string'
        ? current.trim() === v.trim()
        : current === v || (typeof v === 'number' && current != null && Number(current) === v);
    if (!same) changes[k] = v;
  }
  return changes;
}

// ---------------------------------------------------------------------------------------------
// Planning per kind: resolve references, decide create / update, collect errors

async function planTools(rows: ParsedRow<ToolCsvRow>[], today: string, transaction?: Transaction): Promise<Planned<ToolModel>[]> {
  const brands = new Map((await BrandModel.findAll({ transaction })).map((b) => [b.code.toUpperCase(), b]));
  const factories = new Map((await FactoryModel.findAll({ transaction })).map((f) => [f.name.trim().toLowerCase(), f]));
  const codes = rows.map((r) => r.values?.code).filter((c): c is string => !!c);
  const existing = new Map(
    (codes.length ? await ToolModel.findAll({ where: { code: codes }, transaction, ...(transaction ? { lock: transaction.LOCK.UPDATE } : {}) }) : []).map((t) => [t.code, t]),
  );
  const existingIds = [...existing.values()].map((t) => t.id);
  const holding = await changesHolding(existingIds, transaction);
  const cavitiesTaken = new Map<string, number>();
  for (const p of existingIds.length ? await PartModel.findAll({ where: { toolId: existingIds }, attributes: ['toolId', 'cavitiesPerShot'], transaction }) : []) {
    cavitiesTaken.set(p.toolId, (cavitiesTaken.get(p.toolId) ?? 0) + p.cavitiesPerShot);
  }
  return rows.map((r): Planned<ToolModel> => {
    const v = r.values;
    if (!v || r.errors.length) return r;
    const errors = r.errors;
    const brand = brands.get(v.brand_code);
    if (!brand) errors.push({ column: 'brand_code', message: `No brand with code ${v.brand_code}` });
    const factory = factories.get(v.factory.toLowerCase());
    if (!factory) errors.push({ column: 'factory', message: `No factory named "${v.factory}"` });
    const current = existing.get(v.code);
    const currency = v.currency ?? current?.currency.trim() ?? 'USD';
    const buildCostCents = money(v.build_cost, currency, 'build_cost', errors);
    if (v.rated_shots !== undefined && !v.rated_shots_source) errors.push({ column: 'rated_shots_source', message: 'Say where the rated shots come from' });
    const buildDate = v.build_date !== undefined ? v.build_date : (current?.buildDate ?? null);
    const lastRun = v.last_run_date !== undefined ? v.last_run_date : (current?.lastRunDate ?? null);
    if (buildDate && lastRun && lastRun < buildDate) errors.push({ column: 'last_run_date', message: 'The last run cannot be before the build date' });
    let rated: { ratedShots: number; ratedShotsSource: string } | undefined;
    if (v.rated_shots !== undefined && v.rated_shots_source) rated = { ratedShots: v.rated_shots, ratedShotsSource: v.rated_shots_source };
    else if (!current || current.moldClass !== v.mold_class) {
      const keepOwn = current && !isClassDefault(current);
      const fromClass = keepOwn ? null : ratedLifeFromClass(v.mold_class);
      if (fromClass) rated = { ratedShots: fromClass.ratedShots, ratedShotsSource: fromClass.source };
      else if (!keepOwn) errors.push({ column: 'rated_shots', message: `Mold class ${v.mold_class} has no published figure: give rated_shots and rated_shots_source` });
    }
    const taken = current ? (cavitiesTaken.get(current.id) ?? 0) : 0;
    if (v.cavity_count < taken) errors.push({ column: 'cavity_count', message: `The parts of this tool already take ${taken} cavities` });
    if (v.status && (v.status === 'in_change' || v.status === 'disposed') && v.status !== current?.status) {
      errors.push({ column: 'status', message: 'Set active, idle or retained: "in_change" comes from a change request and "disposed" from a retention decision' });
    } else if (v.status && current && v.status !== current.status && holding.get(current.id)?.length) {
      errors.push({ column: 'status', message: `Stays in_change until ${holdingWords(holding.get(current.id)!)} is closed or cancelled` });
    }
    if (errors.length) return r;

    const values: Record<string, unknown> = {
      name: v.name,
      brandId: brand!.id,
      factoryId: factory!.id,
      construction: v.construction,
      moldClass: v.mold_class,
      ...rated,
      cavityCount: v.cavity_count,
      weightKg: v.weight_kg,
      buildCostCents,
      currency: v.currency,
      buildDate: v.build_date,
      shotCount: v.shot_count,
      lastRunDate: v.last_run_date,
      status: v.status,
      storageLocation: v.storage_location,
    };
    if (!current) {
      return {
        ...r,
        op: {
          kind: 'create',
          values: {
            ...values,
            code: v.code,
            weightKg: v.weight_kg ?? null,
            buildCostCents: buildCostCents ?? null,
            currency,
            buildDate: v.build_date ?? null,
            shotCount: v.shot_count ?? 0,
            lastRunDate: v.last_run_date ?? null,
            status: v.status ?? 'active',
            storageLocation: v.storage_location ?? null,
            currentRevision: 1,
            madeOn: v.build_date ?? today,
          },
        },
      };
    }
    const changes = diff(current, values);
    if (Object.keys(changes).length && current.status === 'disposed') {
      errors.push({ column: null, message: `Tool ${v.code} is disposed: its record is read-only` });
      return r;
    }
    return { ...r, op: Object.keys(changes).length ? { kind: 'update', row: current, changes } : { kind: 'unchanged' } };
  });
}

function isClassDefault(t: ToolModel) {
  const d = ratedLifeFromClass(t.moldClass);
  return !!d && d.ratedShots === t.ratedShots && d.source === t.ratedShotsSource;
}

async function toolsByCode(codes: string[], transaction?: Transaction) {
  const unique = [...new Set(codes)];
  return new Map((unique.length ? await ToolModel.findAll({ where: { code: unique }, transaction }) : []).map((t) => [t.code, t]));
}

async function planParts(rows: ParsedRow<PartCsvRow>[], transaction?: Transaction): Promise<Planned<PartModel>[]> {
  const tools = await toolsByCode(rows.map((r) => r.values?.tool_code).filter((c): c is string => !!c), transaction);
  const toolIds = [...tools.values()].map((t) => t.id);
  const parts = toolIds.length ? await PartModel.findAll({ where: { toolId: toolIds }, transaction }) : [];
  const partKey = (toolId: string, name: string) => `${toolId}\u0000${name}`;
  const existing = new Map(parts.map((p) => [partKey(p.toolId, p.name), p]));
  // Cavities per tool after the import: stored parts not in the file plus the file's rows.
  const cavities = new Map<string, number>();
  for (const p of parts) cavities.set(p.toolId, (cavities.get(p.toolId) ?? 0) + p.cavitiesPerShot);

  const planned = rows.map((r): Planned<PartModel> => {
    const v = r.values;
    if (!v || r.errors.length) return r;
    const tool = tools.get(v.tool_code);
    if (!tool) {
      r.errors.push({ column: 'tool_code', message: `No tool with code ${v.tool_code}` });
      return r;
    }
    if (tool.status === 'disposed') {
      r.errors.push({ column: 'tool_code', message: `Tool ${tool.code} is disposed: its record is read-only` });
      return r;
    }
    const current = existing.get(partKey(tool.id, v.part_name));
    cavities.set(tool.id, (cavities.get(tool.id) ?? 0) - (current?.cavitiesPerShot ?? 0) + v.cavities_per_shot);
    const values = { name: v.part_name, resin: v.resin, cavitiesPerShot: v.cavities_per_shot };
    if (!current) return { ...r, op: { kind: 'create', values: { ...values, toolId: tool.id } } };
    const changes = diff(current, values);
    return { ...r, op: Object.keys(changes).length ? { kind: 'update', row: current, changes } : { kind: 'unchanged' } };
  });
  for (const r of planned) {
    const tool = r.values ? tools.get((r.values as PartCsvRow).tool_code) : undefined;
    if (!tool || !r.op) continue;
    const total = cavities.get(tool.id) ?? 0;
    if (total > tool.cavityCount) {
      r.errors.push({ column: 'cavities_per_shot', message: `Tool ${tool.code} has ${tool.cavityCount} cavities; its parts would take ${total}` });
      delete r.op;
    }
  }
  return planned;
}

async function planProducts(rows: ParsedRow<ProductCsvRow>[], transaction?: Transaction): Promise<Planned<ProductModel>[]> {
  const brands = new Map((await BrandModel.findAll({ transaction })).map((b) => [b.code.toUpperCase(), b]));
  const skus = rows.map((r) => r.values?.sku).filter((s): s is string => !!s);
  const existing = new Map(
    (skus.length ? await ProductModel.findAll({ where: { sku: skus }, transaction, ...(transaction ? { lock: transaction.LOCK.UPDATE } : {}) }) : []).map((p) => [p.sku, p]),
  );
  return rows.map((r): Planned<ProductModel> => {
    const v = r.values;
    if (!v || r.errors.length) return r;
    const brand = brands.get(v.brand_code);
    if (!brand) r.errors.push({ column: 'brand_code', message: `No brand with code ${v.brand_code}` });
    const current = existing.get(v.sku);
    const currency = v.currency ?? current?.currency.trim() ?? 'USD';
    const fobCents = money(v.fob, currency, 'fob', r.errors);
    const wholesaleCents = money(v.wholesale, currency, 'wholesale', r.errors);
    const retailCents = money(v.retail, currency, 'retail', r.errors);
    const w = wholesaleCents ?? current?.wholesaleCents;
    const rt = retailCents ?? current?.retailCents;
    if (w != null && rt != null && rt < w) r.errors.push({ column: 'retail', message: 'Retail price is below the wholesale price' });
    if (r.errors.length) return r;
    const values: Record<string, unknown> = {
      name: v.name,
      brandId: brand!.id,
      status: v.status,
      fobCents,
      wholesaleCents,
      retailCents,
      currency: v.currency,
      plannedUnits: v.planned_units,
    };
    if (!current) {
      return {
        ...r,
        op: {
          kind: 'create',
          values: {
            ...values,
            sku: v.sku,
            status: v.status ?? 'in_line',
            fobCents: fobCents ?? null,
            wholesaleCents: wholesaleCents ?? null,
            retailCents: retailCents ?? null,
            currency,
            plannedUnits: v.planned_units ?? 0,
          },
        },
      };
    }
    const changes = diff(current, values);
    return { ...r, op: Object.keys(changes).length ? { kind: 'update', row: current, changes } : { kind: 'unchanged' } };
  });
}

async function planBill(rows: ParsedRow<BillCsvRow>[], transaction?: Transaction): Promise<Planned<BillOfPartsModel>[]> {
  const valid = rows.map((r) => r.values).filter((v): v is BillCsvRow => !!v);
  const tools = await toolsByCode(valid.map((v) => v.tool_code), transaction);
  const skus = [...new Set(valid.map((v) => v.sku))];
  const products = new Map((skus.length ? await ProductModel.findAll({ where: { sku: skus }, transaction }) : []).map((p) => [p.sku, p]));
  const toolIds = [...tools.values()].map((t) => t.id);
  const parts = toolIds.length ? await PartModel.findAll({ where: { toolId: toolIds }, transaction }) : [];
  const partsByKey = new Map(parts.map((p) => [`${p.toolId}\u0000${p.name}`, p]));
  const revisions = new Set(
    (toolIds.length ? await ToolRevisionModel.findAll({ where: { toolId: toolIds }, attributes: ['toolId', 'number'], transaction }) : []).map((r) => `${r.toolId}:${r.number}`),
  );
  const productIds = [...products.values()].map((p) => p.id);
  const lines = productIds.length ? await BillOfPartsModel.findAll({ where: { productId: productIds }, transaction }) : [];
  const linesByKey = new Map(lines.map((l) => [`${l.productId}\u0000${l.partId}`, l]));

  return rows.map((r): Planned<BillOfPartsModel> => {
    const v = r.values;
    if (!v || r.errors.length) return r;
    const product = products.get(v.sku);
    if (!product) r.errors.push({ column: 'sku', message: `No product with SKU ${v.sku}` });
    const tool = tools.get(v.tool_code);
    if (!tool) r.errors.push({ column: 'tool_code', message: `No tool with code ${v.tool_code}` });
    const part = tool ? partsByKey.get(`${tool.id}\u0000${v.part_name}`) : undefined;
    if (tool && !part) r.errors.push({ column: 'part_name', message: `Tool ${tool.code} has no part named "${v.part_name}"` });
    if (r.errors.length) return r;
    const revision = v.revision ?? tool!.currentRevision;
    if (!revisions.has(`${tool!.id}:${revision}`)) r.errors.push({ column: 'revision', message: `Tool ${tool!.code} has no revision ${revision} (it is at ${tool!.currentRevision})` });
    const current = linesByKey.get(`${product!.id}\u0000${part!.id}`);
    if (!current && tool!.status === 'disposed') r.errors.push({ column: 'tool_code', message: `Tool ${tool!.code} is disposed: no product can be newly bound to it` });
    if (r.errors.length) return r;
    const values = { revision, quantityPerUnit: v.quantity_per_unit ?? current?.quantityPerUnit ?? 1 };
    if (!current) return { ...r, op: { kind: 'create', values: { ...values, productId: product!.id, partId: part!.id, toolId: tool!.id } } };
    const changes = diff(current, values);
    if (changes.revision !== undefined && tool!.status === 'disposed') {
      r.errors.push({ column: 'revision', message: `Tool ${tool!.code} is disposed: its lines cannot be moved to another revision` });
      return r;
    }
    return { ...r, op: Object.keys(changes).length ? { kind: 'update', row: current, changes } : { kind: 'unchanged' } };
  });
}

// ---------------------------------------------------------------------------------------------
// Writing

type AnyModel = ToolModel | PartModel | ProductModel | BillOfPartsModel;

const entityOf: Record<ImportKind, string> = { tools: 'tool', parts: 'part', products: 'product', bill: 'bill_line' };

/** The record an audit event keeps, the same as the tool and product services write. */
function auditRecord(kind: ImportKind, row: AnyModel): unknown {
  if (kind === 'tools') return toolAuditRecord(row as ToolModel);
  if (kind === 'products') return productAuditRecord(row as ProductModel);
  if (kind === 'parts') return toPartDto(row as PartModel);
  return row.get({ plain: true });
}

async function apply(kind: ImportKind, plan: Planned<AnyModel>[], actor: Actor, transaction: Transaction) {
  const creates = plan.filter((p) => p.op?.kind === 'create').map((p) => (p.op as { values: Record<string, unknown> }).values);
  const audit: AuditEntry[] = [];
  const entity = entityOf[kind];
  for (let i = 0; i < creates.length; i += 500) {
    const chunk = creates.slice(i, i + 500);
    if (kind === 'tools') {
      const made = await ToolModel.bulkCreate(chunk.map(({ madeOn: _m, ...v }) => v) as never[], { transaction, returning: true });
      await ToolRevisionModel.bulkCreate(
        made.map((t, j) => ({ toolId: t.id, number: 1, madeOn: chunk[j]!.madeOn as string, changeRequestId: null, note: 'As built' })),
        { transaction },
      );
      made.forEach((t) => audit.push({ action: `${entity}.create`, entity, entityId: t.id, before: null, after: auditRecord(kind, t) }));
    } else {
      const model = { parts: PartModel, products: ProductModel, bill: BillOfPartsModel }[kind] as unknown as typeof PartModel;
      const made = await model.bulkCreate(chunk as never[], { transaction, returning: true });
      made.forEach((m) => audit.push({ action: `${entity}.create`, entity, entityId: m.id, before: null, after: auditRecord(kind, m) }));
    }
  }
  for (const p of plan) {
    if (p.op?.kind !== 'update') continue;
    const row = p.op.row as ToolModel;
    const before = auditRecord(kind, row);
    row.set(p.op.changes as Partial<ToolModel>);
    await row.save({ transaction });
    audit.push({ action: `${entity}.update`, entity, entityId: row.id, before, after: auditRecord(kind, row) });
  }
  await recordAudits(transaction, actor, audit);
}

// ---------------------------------------------------------------------------------------------

function report(kind: ImportKind, dryRun: boolean, applied: boolean, fileErrors: string[], plan: Planned<AnyModel>[]): ImportReport {
  const rows: ImportRow[] = plan.map((p) => ({
    line: p.line,
    key: p.key,
    action: p.errors.length || !p.op ? 'error' : p.op.kind,
    errors: p.errors.length || p.op ? p.errors : [{ column: null, message: 'Row could not be checked' }],
  }));
  const count = (a: ImportRow['action']) => rows.filter((r) => r.action === a).length;
  return {
    kind,
    dryRun,
    applied,
    totalRows: rows.length,
    created: count('create'),
    updated: count('update'),
    unchanged: count('unchanged'),
    errorRows: count('error'),
    fileErrors,
    rows,
  };
}

async function plan(kind: ImportKind, csv: string, today: string, transaction?: Transaction) {
  const { rows, fileErrors, rowErrors } = parseFile(csv, kind);
  if (fileErrors.length && (rows.length === 0 || rows.length > MAX_IMPORT_ROWS || fileErrors.some((e) => e.startsWith('Missing')))) {
    return { fileErrors, planned: [] as Planned<AnyModel>[] };
  }
  let planned: Planned<AnyModel>[];
  if (kind === 'tools') {
    const parsed = validateRows(rows, rowErrors, toolCsvRow, (r) => trimKey(r.code).toUpperCase());
    markDuplicates(parsed, 'Tool');
    planned = await planTools(parsed, today, transaction);
  } else if (kind === 'parts') {
    const parsed = validateRows(rows, rowErrors, partCsvRow, (r) => `${trimKey(r.tool_code).toUpperCase()} / ${trimKey(r.part_name)}`);
    markDuplicates(parsed, 'Part');
    planned = await planParts(parsed, transaction);
  } else if (kind === 'products') {
    const parsed = validateRows(rows, rowErrors, productCsvRow, (r) => trimKey(r.sku).toUpperCase());
    markDuplicates(parsed, 'SKU');
    planned = await planProducts(parsed, transaction);
  } else {
    const parsed = validateRows(rows, rowErrors, billCsvRow, (r) => `${trimKey(r.sku).toUpperCase()} / ${trimKey(r.tool_code).toUpperCase()} / ${trimKey(r.part_name)}`);
    markDuplicates(parsed, 'Bill line');
    planned = await planBill(parsed, transaction);
  }
  return { fileErrors, planned };
}

export async function importRegistryCsv(sequelize: Sequelize, actor: Actor, kind: ImportKind, csv: string, dryRun: boolean): Promise<ImportReport> {
  const today = todayInZone(actor.timeZone);
  if (dryRun) {
    const { fileErrors, planned } = await plan(kind, csv, today);
    return report(kind, true, false, fileErrors, planned);
  }
  return sequelize.transaction(async (transaction) => {
    const { fileErrors, planned } = await plan(kind, csv, today, transaction);
    const r = report(kind, false, false, fileErrors, planned);
    if (r.fileErrors.length || r.errorRows > 0) {
      const problems = r.fileErrors.length ? r.fileErrors.join('; ') : `${r.errorRows} of ${r.totalRows} rows have errors`;
      throw new AppError('validation_failed', `Nothing was imported: ${problems}. Fix them and import again.`, 400, undefined, { report: r });
    }
    await apply(kind, planned, actor, transaction);
    await recordAudit(transaction, actor, 'registry.import', entityOf[kind], null, null, {
      kind,
      rows: r.totalRows,
      created: r.created,
      updated: r.updated,
      unchanged: r.unchanged,
    });
    return { ...r, applied: true };
  });
}

// ---------------------------------------------------------------------------------------------
// Export

export function toolsToCsv(tools: Tool[]): string {
  const columns = columnsOf.tools;
  const rows = tools.map((t) => ({
    code: t.code,
    name: t.name,
    brand_code: t.brand.code,
    factory: t.factory.name,
    construction: t.construction,
    mold_class: t.moldClass,
    rated_shots: t.ratedShots,
    rated_shots_source: t.ratedShotsSource,
    cavity_count: t.cavityCount,
    weight_kg: t.weightKg ?? '',
    build_cost: t.buildCostCents === null ? '' : centsToDecimalString(t.buildCostCents, t.currency),
    currency: t.currency,
    build_date: t.buildDate ?? '',
    shot_count: t.shotCount,
    last_run_date: t.lastRunDate ?? '',
    status: t.status,
    storage_location: t.storageLocation ?? '',
    current_revision: t.currentRevision,
    remaining_shots: t.life.remainingShots,
    percent_used: t.life.percentUsed,
    life_band: t.life.band,
    retention_due_on: t.retention.dueOn ?? '',
  }));
  // escapeFormulae: a cell starting with = + - @ is prefixed with ' so spreadsheets do not run it.
  return Papa.unparse({ fields: [...columns], data: rows.map((r) => columns.map((c) => r[c as keyof typeof r])) }, { escapeFormulae: FORMULA_LIKE, newline: '\r\n' });
}

