import express, { Router } from 'express';
import { z } from 'zod';
import {
  createBillEntryInput,
  csvColumnsOf,
  createPartInput,
  createProductInput,
  createToolInput,
  importKindSchema,
  importQuery,
  listProductsQuery,
  listToolsQuery,
  retentionDecisionInput,
  retentionDueQuery,
  retentionYearsInput,
  updateBillEntryInput,
  updatePartInput,
  updateProductInput,
  updateToolInput,
} from '../../shared/schemas/registry';
import { actorOf, requireRole } from '../lib/auth';
import { AppError } from '../lib/errors';
import { deps, parseQuery } from '../lib/validate';
import * as products from '../services/products';
import { importRegistryCsv, toolsToCsv } from '../services/registry-csv';
import * as tools from '../services/tools';
import { idOf } from '../lib/params';


const csvBody = express.text({ type: ['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel'], limit: '5mb' });
const jsonCsv = z.object({ csv: z.string({ message: 'Send the CSV text as "csv"' }).min(1, { message: 'The CSV is empty' }) });

/**
 * The tool registry API. Reads: every signed-in role (toolmakers only their own factory's tools,
 * and the products that use them). Writes: engineers and admins; the retention period: admins.
 */
export function registryRouter() {
  const r = Router();
  const writers = requireRole('engineer', 'admin');
  // Reads are open to every role; the services narrow what a toolmaker sees to their own factory.
  const readers = requireRole('designer', 'engineer', 'brand_lead', 'toolmaker', 'admin');

  // Tools
  r.get('/tools', readers, async (req, res) => {
    res.json(await tools.listTools(deps(res).sequelize, actorOf(res), parseQuery(listToolsQuery, req.query)));
  });
  r.get('/tools/export.csv', readers, async (req, res) => {
    const { cursor: _c, limit: _l, ...filters } = parseQuery(listToolsQuery, req.query);
    const rows = await tools.allMatchingTools(deps(res).sequelize, actorOf(res), filters);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="tools-${new Date().toISOString().slice(0, 10)}.csv"`);
    res.send(toolsToCsv(rows));
  });
  r.get('/tools/:id', readers, async (req, res) => {
    res.json(await tools.getToolDetail(actorOf(res), idOf(req.params.id, 'Tool')));
  });
  r.post('/tools', writers, async (req, res) => {
    res.status(201).json(await tools.createTool(deps(res).sequelize, actorOf(res), createToolInput.parse(req.body)));
  });
  r.patch('/tools/:id', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Tool');
    res.json(await tools.updateTool(deps(res).sequelize, actorOf(res), id, updateToolInput.parse(req.body)));
  });
  r.post('/tools/:id/retention-decision', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Tool');
    res.json(await tools.recordRetentionDecision(deps(res).sequelize, actorOf(res), id, retentionDecisionInput.parse(req.body)));
  });

  // Parts
  r.post('/tools/:id/parts', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Tool');
    res.status(201).json(await tools.createPart(deps(res).sequelize, actorOf(res), id, createPartInput.parse(req.body)));
  });
  r.patch('/parts/:id', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Part');
    res.json(await tools.updatePart(deps(res).sequelize, actorOf(res), id, updatePartInput.parse(req.body)));
  });

  // Retention
  r.get('/retention/due', readers, async (req, res) => {
    const { days } = parseQuery(retentionDueQuery, req.query);
    res.json(await tools.listRetentionDue(deps(res).sequelize, actorOf(res), days));
  });
  r.get('/settings/retention', readers, async (_req, res) => {
    res.json(await tools.getRetentionSettings());
  });
  r.put('/settings/retention', requireRole('admin'), async (req, res) => {
    const { years } = retentionYearsInput.parse(req.body);
    res.json(await tools.setRetentionYears(deps(res).sequelize, actorOf(res), years));
  });

  // Products and their bill of parts
  r.get('/products', readers, async (req, res) => {
    res.json(await products.listProducts(deps(res).sequelize, actorOf(res), parseQuery(listProductsQuery, req.query)));
  });
  r.get('/products/:id', readers, async (req, res) => {
    res.json(await products.getProductDetail(actorOf(res), idOf(req.params.id, 'Product')));
  });
  r.post('/products', writers, async (req, res) => {
    res.status(201).json(await products.createProduct(deps(res).sequelize, actorOf(res), createProductInput.parse(req.body)));
  });
  r.patch('/products/:id', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Product');
    res.json(await products.updateProduct(deps(res).sequelize, actorOf(res), id, updateProductInput.parse(req.body)));
  });
  r.post('/products/:id/bill', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Product');
    res.status(201).json(await products.createBillEntry(deps(res).sequelize, actorOf(res), id, createBillEntryInput.parse(req.body)));
  });
  r.patch('/bill-entries/:id', writers, async (req, res) => {
    const id = idOf(req.params.id, 'Bill line');
    res.json(await products.updateBillEntry(deps(res).sequelize, actorOf(res), id, updateBillEntryInput.parse(req.body)));
  });
  r.delete('/bill-entries/:id', writers, async (req, res) => {
    await products.deleteBillEntry(deps(res).sequelize, actorOf(res), idOf(req.params.id, 'Bill line'));
    res.status(204).end();
  });

  // CSV import: ?kind=tools|parts|products|bill&dryRun=true|false; body text/csv, or JSON { "csv": "..." }.
  r.post('/registry/import', writers, csvBody, async (req, res) => {
    const { kind, dryRun } = parseQuery(importQuery, req.query);
    const csv = typeof req.body === 'string' ? req.body : jsonCsv.parse(req.body ?? {}).csv;
    if (!csv.trim()) throw new AppError('validation_failed', 'The CSV is empty', 400, { csv: ['The CSV is empty'] });
    res.json(await importRegistryCsv(deps(res).sequelize, actorOf(res), kind, csv, dryRun));
  });
  r.get('/registry/import/template', readers, async (req, res) => {
    const { kind } = parseQuery(z.object({ kind: importKindSchema }), req.query);
    const columns = csvColumnsOf[kind];
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${kind}-template.csv"`);
    res.send(`${columns.join(',')}\r\n`);
  });
  return r;
}
