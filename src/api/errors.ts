// The one error type every API call throws. `code` is the server's snake_case code, or one of the
// client's own: 'network' (no answer), 'bad_data' (an answer that does not match the shared schema).
export type ClientErrorCode = 'network' | 'bad_data';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fieldErrors?: Record<string, string[]>;
  /** The whole `error` object of the answer, for codes that carry more (stale_version's `current`). */
  readonly details?: Record<string, unknown>;

  constructor(status: number, code: string, message: string, fieldErrors?: Record<string, string[]>, details?: Record<string, unknown>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fieldErrors = fieldErrors;
    this.details = details;
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

export const NETWORK_MESSAGE = 'Cannot reach Toolgate. Check your connection, then try again.';
export const BAD_DATA_MESSAGE = 'Toolgate sent an answer this screen does not understand. Reload the page; if it keeps happening, tell your administrator.';

/** Words for a person, never a stack or a status number. */
export function toUserMessage(e: unknown): string {
  if (isApiError(e)) return e.message;
  return 'Something went wrong. Try again; if it keeps happening, tell your administrator.';
}

/** Server fieldErrors ({ email: ['...'] }) to Formik errors ({ email: '...' }). Keys like `brandIds.0` fold to `brandIds`. */
export function firstMessages(fieldErrors: Record<string, string[]>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, messages] of Object.entries(fieldErrors)) {
    const field = key.split('.')[0] ?? key;
    if (!out[field] && messages[0]) out[field] = messages[0];
  }
  return out;
}

/**
 * Copies a failed submit into a Formik form: field messages onto the fields it has, the rest into
 * the form status. Returns what it did so callers can focus or scroll.
 */
export function applyServerErrors(
  e: unknown,
  fields: readonly string[],
  helpers: { setErrors: (errors: Record<string, string>) => void; setStatus: (status: unknown) => void },
): void {
  if (isApiError(e) && e.fieldErrors) {
    const messages = firstMessages(e.fieldErrors);
    const onFields = Object.fromEntries(Object.entries(messages).filter(([k]) => fields.includes(k)));
    helpers.setErrors(onFields);
    const elsewhere = Object.keys(messages).length > Object.keys(onFields).length;
    helpers.setStatus(elsewhere || Object.keys(onFields).length === 0 ? e.message : undefined);
    return;
  }
  helpers.setStatus(toUserMessage(e));
}
