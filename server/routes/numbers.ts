import { Router } from 'express';
import { saveNumbersInput } from '../../shared/schemas/numbers';
import { roles } from '../../shared/schemas/users';
import { actorOf, requireRole } from '../lib/auth';
import { deps } from '../lib/validate';
import { getRequestNumbers, getToolOpenPlans, saveRequestNumbers } from '../services/request-numbers';
import { idOf } from '../lib/params';


/**
 * The numbers behind a change. Read: everyone who may see the request except toolmakers (prices and
 * margins stay with the brand and engineering). Save: a tooling engineer during engineering review,
 * with the request version they saw. A tool's life against its open plans: everyone who may see
 * the tool, counting the requests they may see.
 */
export function numbersRouter() {
  const r = Router();
  r.get('/requests/:id/numbers', requireRole('admin', 'designer', 'engineer', 'brand_lead'), async (req, res) => {
    res.json(await getRequestNumbers(actorOf(res), idOf(req.params.id, 'Change request')));
  });
  r.put('/requests/:id/numbers', requireRole('engineer'), async (req, res) => {
    const id = idOf(req.params.id, 'Change request');
    res.json(await saveRequestNumbers(deps(res).sequelize, actorOf(res), id, saveNumbersInput.parse(req.body)));
  });
  r.get('/tools/:id/open-plans', requireRole(...roles), async (req, res) => {
    res.json(await getToolOpenPlans(actorOf(res), idOf(req.params.id, 'Tool')));
  });
  return r;
}
