import { z } from 'zod';
import { boundedDate } from './dates';
import { shotCountSchema } from './registry';

/** Who reported a shot-counter reading: the factory, the engineer, or a recorded step on the tool. */
export const shotReadingSources = ['factory', 'engineer', 'cut', 'handover', 'arrival', 'trial'] as const;
export type ShotReadingSource = (typeof shotReadingSources)[number];

export const shotReadingSourceLabels: Record<ShotReadingSource, string> = {
  factory: 'Reported by the factory',
  engineer: 'Reported by the engineer',
  cut: 'Read at the cut',
  handover: 'Read at handover',
  arrival: 'Read on arrival',
  trial: 'Read after the trial',
};

/** What a person types to report a reading (the source follows from who they are). */
export const recordShotReadingInput = z.object({
  reading: shotCountSchema,
  readOn: boundedDate(),
  note: z.string().trim().max(500).optional(),
});
export type RecordShotReadingInput = z.infer<typeof recordShotReadingInput>;

export const shotReadingSchema = z.object({
  id: z.string(),
  toolId: z.string(),
  reading: z.number().int(),
  previous: z.number().int(),
  readAt: z.string(),
  source: z.enum(shotReadingSources),
  recordedBy: z.string().nullable(),
  recordedByName: z.string().nullable(),
  requestId: z.string().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
});
export type ShotReading = z.infer<typeof shotReadingSchema>;
