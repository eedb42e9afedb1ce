import { z } from 'zod';
import { boundedDate } from './dates';
import { requestActions, requestStates } from '../domain/lifecycle';
import { requestDetailSchema } from './change-requests';
import { signOffSchema } from './sign-offs';

export const requestStateSchema = z.enum(requestStates);
export const requestActionSchema = z.enum(requestActions);

const decimalText = (what: string) =>
  z.string({ message: `Enter the ${what}` }).trim().regex(/^-?\d{1,6}(\.\d{1,4})?$/, { message: `Enter the ${what} as a number, e.g. 12.40` });

/** One cut item's first-article line, in the item's unit. */
export const firstArticleLine = z.object({
  itemId: z.uuid({ message: 'Pick the cut item' }),
  intended: decimalText('intended dimension'),
  tolerance: decimalText('tolerance').refine((v) => !v.startsWith('-'), { message: 'A tolerance cannot be negative' }),
  measured: decimalText('measured dimension'),
});
export type FirstArticleLineInput = z.infer<typeof firstArticleLine>;

/** The cut as the engineer or the factory's toolmaker reports it with "Record the cut as done". */
export const cutReportInput = z.object({
  /** What the change actually cost, in whole cents (the tool's currency). */
  actualCostCents: z
    .number({ message: 'Enter the actual cost in cents' })
    .int({ message: 'Whole cents only' })
    .min(0, { message: 'The cost cannot be negative' })
    .max(100_000_000_00, { message: 'That cost is too large' }),
  /** The day the tool was cut (not in the future). */
  cutOn: boundedDate('Use a date like 2027-03-31'),
  note: z.string().trim().max(4000, { message: 'Keep the note under 4000 characters' }).default(''),
  /** The currency of the actual cost (ISO 4217). */
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, { message: 'Use a three-letter currency code such as USD or CNY' }),
  /** The mold trial that shot the first samples: its day and how many shots it ran. */
  trialOn: boundedDate('Use a date like 2027-03-31'),
  trialShots: z.number({ message: 'Enter how many shots the trial ran' }).int({ message: 'Whole shots only' }).min(1, { message: 'A trial runs at least one shot' }).max(10_000_000, { message: 'That is too many shots for a trial' }),
  /** The tool's shot counter after the trial (it becomes the tool's shot count). */
  shotReading: z.number({ message: 'Enter the shot counter reading' }).int({ message: 'Whole shots only' }).min(0, { message: 'A counter reading cannot be negative' }).max(1_000_000_000_000, { message: 'That reading is too large' }),
  /** One line per cut item: the dimension measured on a molded sample against the intended one. */
  firstArticle: z.array(firstArticleLine).min(1, { message: 'Measure every cut item on a molded sample' }).max(200),
});
export type CutReportInput = z.input<typeof cutReportInput>;

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
  /** Only with record_cut, where it is required: the actual cost, the date and a note. */
  cut: cutReportInput.optional(),
}).superRefine((v, ctx) => {
  if (v.target !== undefined && v.action !== 'return') {
    ctx.addIssue({ code: 'custom', path: ['target'], message: 'Only "Send back" from brand sign-off takes a target' });
  }
  if (v.cut !== undefined && v.action !== 'record_cut') {
    ctx.addIssue({ code: 'custom', path: ['cut'], message: 'Only "Record the cut as done" takes a cut report' });
  }
});
export type TakeActionInput = z.infer<typeof takeActionInput>;

/**
 * The answer to POST /api/requests/:id/actions: the request as it is now, and the sign-off written
 * (or, for a retried call with the same Idempotency-Key, the one written the first time).
 */
export const takeActionResponseSchema = z.object({
  request: requestDetailSchema,
  signOff: signOffSchema,
  /** True when this answers a retry: nothing new was signed. */
  replayed: z.boolean(),
});
export type TakeActionResponse = z.infer<typeof takeActionResponseSchema>;
