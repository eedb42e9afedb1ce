import { z } from 'zod';

/**
 * The dates Toolgate takes as input: real calendar dates from 1900-01-01 to 2200-12-31. Wider than
 * any tool's life or a plan's horizon, and far enough inside the range every date computation
 * (due dates, retention, life) can add years to without leaving what a date can hold.
 */
export const EARLIEST_DATE = '1900-01-01';
export const LATEST_DATE = '2200-12-31';

export const boundedDate = (message = 'Use a calendar date, YYYY-MM-DD') =>
  z.iso
    .date({ message })
    .refine((v) => v >= EARLIEST_DATE && v <= LATEST_DATE, { message: 'Use a date between 1900-01-01 and 2200-12-31' });
