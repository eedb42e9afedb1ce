import { Router } from 'express';
import { takeActionInput } from '../../shared/schemas/request-actions';
import { roles } from '../../shared/schemas/users';
import { actorOf, requireRole } from '../lib/auth';
import { AppError } from '../lib/errors';
import { deps } from '../lib/validate';
import { listInbox, listSignOffs, takeAction, verifySignOffs } from '../services/workflow';
import { idOf } from '../lib/params';

const requestIdOf = (raw: unknown) => idOf(raw, 'Change request');

/** Idempotency-Key: optional; 1 to 200 visible ASCII characters (a UUID is a good choice). */
function idempotencyKeyOf(raw: string | undefined) {
  if (raw === undefined) return undefined;
  const key = raw.trim();
  if (!/^[\x21-\x7e]{1,200}$/.test(key)) {
    throw new AppError('validation_failed', 'The Idempotency-Key header must be 1 to 200 visible characters, such as a UUID.', 400, {
      idempotencyKey: ['1 to 200 visible characters'],
    });
  }
  return key;
}

const anyRole = requireRole(...roles);

/**
 * The sign-off workflow on change requests (mounted at /api/requests beside requestsRouter):
 *   POST /:id/actions             take an action (sign, return, withdraw ...); Idempotency-Key honoured
 *   GET  /:id/sign-offs           the timeline
 *   GET  /:id/sign-offs/verify    recompute the hash chain
 * Every role may call them; the lifecycle and the request's visibility decide the rest.
 */
export function workflowRouter() {
  const r = Router();
  r.post('/:id/actions', anyRole, async (req, res) => {
    const id = requestIdOf(req.params.id);
    const idempotencyKey = idempotencyKeyOf(req.get('idempotency-key'));
    const input = takeActionInput.parse(req.body);
    const result = await takeAction(deps(res), actorOf(res), id, input, { idempotencyKey });
    if (result.replayed) res.setHeader('Idempotent-Replayed', 'true');
    res.status(result.replayed ? 200 : 201).json(result);
  });
  r.get('/:id/sign-offs', anyRole, async (req, res) => {
    res.json(await listSignOffs(actorOf(res), requestIdOf(req.params.id)));
  });
  r.get('/:id/sign-offs/verify', anyRole, async (req, res) => {
    res.json(await verifySignOffs(actorOf(res), requestIdOf(req.params.id)));
  });
  return r;
}

/** GET /api/inbox: what waits for the caller's action. */
export function inboxRouter() {
  const r = Router();
  r.get('/', anyRole, async (_req, res) => {
    res.json(await listInbox(deps(res).sequelize, actorOf(res)));
  });
  return r;
}
