import { Router } from 'express';
import { actorOf } from '../lib/auth';
import { setLanguageInput } from '../../shared/schemas/users';
import * as users from '../services/users';

export function meRouter() {
  const r = Router();
  r.get('/', async (_req, res) => {
    res.json(await users.getMe(actorOf(res).id));
  });
  r.put('/language', async (req, res) => {
    const { language } = setLanguageInput.parse(req.body);
    res.json(await users.setMyLanguage(actorOf(res), language));
  });
  return r;
}
