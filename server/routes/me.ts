import { Router } from 'express';
import { actorOf } from '../lib/auth';
import * as users from '../services/users';

export function meRouter() {
  const r = Router();
  r.get('/', async (_req, res) => {
    res.json(await users.getMe(actorOf(res).id));
  });
  return r;
}
