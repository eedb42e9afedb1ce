import { Router } from 'express';
import { requireRole } from '../lib/auth';
import { verifyAuditChain } from '../services/audit-chain';

/** GET /api/audit/verify (administrators): recomputes the audit chain and checks its anchors. */
export function auditRouter() {
  const r = Router();
  r.get('/verify', requireRole('admin'), async (_req, res) => {
    res.json(await verifyAuditChain());
  });
  return r;
}
