import { z } from 'zod';
import { AppError } from './errors';

/**
 * The id in a path, checked the same way by every route: an id that is not a UUID names nothing,
 * so it gets the same 404 as an id that does not exist (`what` names the record, e.g. "Tool").
 */
export function idOf(raw: unknown, what: string): string {
  const parsed = z.uuid().safeParse(raw);
  if (!parsed.success) throw new AppError('not_found', `${what} was not found`, 404);
  return parsed.data;
}
