import { z } from 'zod';
import { requestActions } from '../domain/lifecycle';
import { requestSummarySchema } from './change-requests';

// GET /api/inbox: the requests that wait for the caller's action, overdue first, then oldest first.

export const inboxItemSchema = requestSummarySchema.extend({
  /** The actions the caller may take now (the ones the request waits for). */
  waitingFor: z.array(z.enum(requestActions)),
  /** UTC, ISO 8601: when the request entered its current stage. */
  stageEnteredAt: z.string(),
  overdue: z.boolean(),
});
export type InboxItem = z.infer<typeof inboxItemSchema>;

export const inboxResponseSchema = z.object({
  data: z.array(inboxItemSchema),
  meta: z.object({ total: z.number().int(), overdue: z.number().int() }),
});
export type InboxResponse = z.infer<typeof inboxResponseSchema>;
