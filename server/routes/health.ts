import { Router } from 'express';
import type { AppDeps } from '../app';

export function healthRouter({ sequelize }: AppDeps) {
  const r = Router();
  r.get('/', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.json({ status: 'ok', db: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', db: 'down', error: { code: 'unavailable', message: 'The database is not reachable.' } });
    }
  });
  return r;
}
