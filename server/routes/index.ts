// Mounts every API router. A feature adds its router here.
import { Router } from 'express';
import type { AppDeps } from '../app';
import { requireAuth } from '../lib/auth';
import { authRouter } from './auth';
import { healthRouter } from './health';
import { meRouter } from './me';
import { organisationRouter } from './organisation';
import { registryRouter } from './registry';
import { attachmentsRouter, requestsRouter } from './requests';
import { usersRouter } from './users';

export function apiRouter(deps: AppDeps) {
  const r = Router();
  r.use('/health', healthRouter(deps));
  r.use('/auth', authRouter(deps));
  // Everything below needs a signed-in, active user.
  r.use(requireAuth);
  r.use('/me', meRouter());
  r.use('/users', usersRouter());
  r.use('/', organisationRouter());
  r.use('/', registryRouter());
  r.use('/requests', requestsRouter());
  r.use('/attachments', attachmentsRouter());
  return r;
}
