import { z } from 'zod';

export const brandSchema = z.object({
  id: z.string().uuid(),
  code: z.string(),
  name: z.string(),
});
export type Brand = z.infer<typeof brandSchema>;

export const createBrandInput = z.object({
  code: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9]{2,6}$/, { message: 'Use 2 to 6 letters or digits, e.g. SR' }),
  name: z.string().trim().min(2, { message: 'Enter the brand name' }).max(120),
});
export type CreateBrandInput = z.input<typeof createBrandInput>;

export const factorySchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  city: z.string(),
  country: z.string(),
  timeZone: z.string(),
});
export type Factory = z.infer<typeof factorySchema>;

export const createFactoryInput = z.object({
  name: z.string().trim().min(2, { message: 'Enter the factory name' }).max(120),
  city: z.string().trim().min(1, { message: 'Enter the city' }).max(120),
  country: z.string().trim().min(2, { message: 'Enter the country' }).max(80),
  timeZone: z.string().trim().min(1).max(64).default('UTC'),
});
export type CreateFactoryInput = z.input<typeof createFactoryInput>;
