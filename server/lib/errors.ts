import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import {
  ForeignKeyConstraintError,
  OptimisticLockError,
  UniqueConstraintError,
  ValidationError as SequelizeValidationError,
} from 'sequelize';
import { ZodError, z } from 'zod';
import type { ErrorCode } from '../../shared/errors';
import { localizeError } from './localize-error';

export class AppError extends Error {
  constructor(
    public code: ErrorCode,
    message: string,
    public status: number,
    public fieldErrors?: Record<string, string[]>,
    public extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} was not found`, 404);
export const forbidden = (message = 'Your role may not do this') => new AppError('forbidden', message, 403);

export const routeNotFound: RequestHandler = (req, _res, next) =>
  next(new AppError('not_found', `No API route for ${req.method} ${req.path}`, 404));

function zodFieldErrors(err: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

// Express 5 forwards rejected promises here: no try/catch in routes.
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; fieldErrors?: Record<string, string[]> } & Record<string, unknown> = {
    code: 'internal',
    message: 'Something went wrong on our side. Try again; if it keeps happening, tell your administrator.',
  };
  if (err instanceof AppError) {
    status = err.status;
    const { i18n: _i18n, ...extra } = err.extra ?? {};
    body = { code: err.code, message: err.message, ...(err.fieldErrors ? { fieldErrors: err.fieldErrors } : {}), ...extra };
  } else if (err instanceof ZodError) {
    status = 400;
    const fieldErrors = zodFieldErrors(err);
    const first = err.issues[0];
    body = {
      code: 'validation_failed',
      message: `Check the highlighted fields: ${first ? `${first.path.join('.') || 'input'}: ${first.message}` : 'invalid input'}`,
      fieldErrors,
    };
  } else if (err instanceof MulterError) {
    status = err.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    body = {
      code: status === 413 ? 'payload_too_large' : 'validation_failed',
      message: status === 413 ? 'The file is too large. Pick a smaller file or lower the photo resolution.' : err.message,
    };
  } else if (err instanceof UniqueConstraintError) {
    status = 409;
    const fields = Object.keys(err.fields ?? {});
    body = {
      code: 'conflict',
      message: `That ${fields.join(', ') || 'value'} is already in use.`,
      ...(fields.length ? { fieldErrors: Object.fromEntries(fields.map((f) => [f, ['Already in use']])) } : {}),
    };
  } else if (err instanceof ForeignKeyConstraintError) {
    status = 409;
    body = { code: 'conflict', message: 'That record refers to something that does not exist or is still in use.' };
  } else if (err instanceof OptimisticLockError) {
    status = 409;
    body = { code: 'stale_version', message: 'Someone else changed this record. Reload it and try again.' };
  } else if (err instanceof SequelizeValidationError) {
    status = 400;
    body = { code: 'validation_failed', message: err.errors.map((e) => e.message).join('; ') };
  } else if (err?.type === 'entity.parse.failed') {
    status = 400;
    body = { code: 'bad_json', message: 'The request body is not valid JSON.' };
  } else if (err?.type === 'entity.too.large') {
    status = 413;
    body = { code: 'payload_too_large', message: 'The request body is too large.' };
  } else if (typeof err?.status === 'number' && err.status >= 400 && err.status < 500) {
    status = err.status;
    body = { code: 'validation_failed', message: String(err.message ?? 'Bad request') };
  }
  if (status >= 500) req.log?.error({ err }, 'request failed');
  // A reader of another language gets the message in it (the code stays the same).
  const language = (res.locals.user as { language?: string } | undefined)?.language;
  if (language && language !== 'en') body = localizeError(body, language, err instanceof AppError ? err.extra?.i18n : undefined);
  res.status(status).json({ error: body });
};

export { z };
