// The app's only reader of build-time settings. EXPO_PUBLIC_* keys only (they end up in the bundle:
// never put a secret here), each read with static dot access so Metro can inline it.
import { z } from 'zod';

const envSchema = z.object({
  /** Where the API lives. Empty: the same origin that served the web app (the normal case). */
  EXPO_PUBLIC_API_URL: z
    .string()
    .default('')
    .refine((v) => v === '' || /^https?:\/\/[^/]+/.test(v), { message: 'must be empty or an http(s) origin' })
    .transform((v) => v.replace(/\/+$/, '')),
});

const parsed = envSchema.safeParse({ EXPO_PUBLIC_API_URL: process.env.EXPO_PUBLIC_API_URL });
if (!parsed.success) {
  throw new Error(`Bad app settings: ${parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; ')}`);
}

export const env = parsed.data;
