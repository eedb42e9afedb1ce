import { Router } from 'express';
import { z } from 'zod';
import { saveNumbersInput } from '../../shared/schemas/numbers';
import { roles } from '../../shared/schemas/users';
import { actorOf, requireRole } from '../lib/auth';
import { AppError } from '../lib/errors';
import { deps } from '../lib/validate';
import { getRequestNumbers, getToolOpenPlans, saveRequestNumbers } from '../services/request-numbers';

/** A path id that is not a UUID names nothing: 404, like an id that does not exist. */
const idOf = (raw: unknown, what: string) => {
  const parsed = z.uuid().safeParse(raw);
  if (!parsed.success) throw new AppError('not_found', `${what} was not found`, 404);
  return parsed.data;
};

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
