import { z } from 'zod';
import { requestActions, requestStates } from '../domain/lifecycle';

export const requestStateSchema = z.enum(requestStates);
export const requestActionSchema = z.enum(requestActions);

/**
 * What a client sends to take an action on a change request. `version` is the request version the
 * signer saw (optimistic locking: a stale version is refused with 409 and a fresh copy).
 * What each action needs beyond this shape is checked by `checkSubmission` (shared/domain/lifecycle).
 */
export const takeActionInput = z.object({
  action: requestActionSchema,
  version: z.number().int().min(0),
  /** Only for return from brand sign-off: engineering_review (default) or draft. */
  target: z.enum(['engineering_review', 'draft']).optional(),
  comment: z.string().trim().max(4000, { message: 'Keep the comment under 4000 characters' }).optional(),
  password: z.string().max(200).optional(),
  confirmedProductIds: z.array(z.uuid()).max(500).optional(),
  typedToolCode: z.string().trim().max(40).optional(),
  retestNote: z.string().trim().max(4000, { message: 'Keep the re-test note under 4000 characters' }).optional(),
}).superRefine((v, ctx) => {
  if (v.target !== undefined && v.action !== 'return') {
    ctx.addIssue({ code: 'custom', path: ['target'], message: 'Only "Send back" from brand sign-off takes a target' });
  }
});
export type TakeActionInput = z.infer<typeof takeActionInput>;
