import { z } from 'zod';

export const errorCodes = [
  'validation_failed',
  'bad_json',
  'unauthorized',
  'forbidden',
  'not_found',
  'conflict',
  'stale_version',
  'wrong_state',
  'gate_not_passed',
  'idempotency_mismatch',
  'receipt_missing',
  'sample_photo_missing',
  'shot_reading_lower',
  'payload_too_large',
  'unsupported_media_type',
  'rate_limited',
  'unavailable',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
