// Mounts every API router. A feature adds its router here.
import { Router } from 'express';
import type { AppDeps } from '../app';
import { requireAuth } from '../lib/auth';
import { refuseUnstorableText } from '../lib/text-guard';
import { auditRouter } from './audit';
import { authRouter } from './auth';
import { healthRouter } from './health';
import { meRouter } from './me';
import { numbersRouter } from './numbers';
import { organisationRouter } from './organisation';
import { registryRouter } from './registry';
import { attachmentsRouter, requestsRouter } from './requests';
import { usersRouter } from './users';
import { inboxRouter, workflowRouter } from './workflow';

export function apiRouter(deps: AppDeps) {
  const r = Router();
  // NUL and broken characters are refused before any route (or the audit) sees them.
  r.use(refuseUnstorableText);
  r.use('/health', healthRouter(deps));
  r.use('/auth', authRouter(deps));
  // Everything below needs a signed-in, active user.
  r.use(requireAuth);
  r.use('/me', meRouter());
  r.use('/users', usersRouter());
  r.use('/audit', auditRouter());
  r.use('/', organisationRouter());
  r.use('/', registryRouter());
  r.use('/', numbersRouter());
  r.use('/requests', requestsRouter());
  r.use('/requests', workflowRouter());
  r.use('/inbox', inboxRouter());
  r.use('/attachments', attachmentsRouter());
  return r;
}
