import { Router } from 'express';
import { createBrandInput, createFactoryInput } from '../../shared/schemas/organisation';
import { actorOf, requireRole } from '../lib/auth';
import * as org from '../services/organisation';

// Brands and factories: every signed-in user may read the names; only admins create.
export function organisationRouter() {
  const r = Router();
  r.get('/brands', async (_req, res) => {
    res.json({ data: await org.listBrands(), meta: {} });
  });
  r.post('/brands', requireRole('admin'), async (req, res) => {
    res.status(201).json(await org.createBrand(actorOf(res), createBrandInput.parse(req.body)));
  });
  r.get('/factories', async (_req, res) => {
    res.json({ data: await org.listFactories(), meta: {} });
  });
  r.post('/factories', requireRole('admin'), async (req, res) => {
    res.status(201).json(await org.createFactory(actorOf(res), createFactoryInput.parse(req.body)));
  });
  return r;
}
