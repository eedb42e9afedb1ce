import type { Response } from 'express';
import type { AppDeps } from '../app';
import type { z } from 'zod';

// Express 5: req.query is read-only, so parsed queries are returned, not written back.
export const parseQuery = <S extends z.ZodType>(schema: S, query: unknown): z.infer<S> => schema.parse(query);

export const deps = (res: Response) => res.app.locals.deps as AppDeps;
