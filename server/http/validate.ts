import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { badRequest } from './errors';

/** Turns zod issues into `{ 'points.3.v': 'must be a finite number' }`. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parses a value with a schema or throws a 400 naming every bad field. */
export function parseOrThrow<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fields = fieldMessages(result.error);
  const summary = Object.entries(fields)
    .slice(0, 3)
    .map(([field, message]) => (field === '_' ? message : `${field} ${message}`))
    .join('; ');
  throw badRequest(`Invalid input: ${summary}.`, fields);
}

/** Middleware: replaces `req.body` with the parsed body, or answers 400. */
export function validateBody<T extends z.ZodType>(schema: T): RequestHandler {
  return (req, _res, next) => {
    req.body = parseOrThrow(schema, req.body ?? {});
    next();
  };
}

/** Middleware: parses the query string into `res.locals.query`, or answers 400. */
export function validateQuery<T extends z.ZodType>(schema: T): RequestHandler {
  return (req, res, next) => {
    res.locals.query = parseOrThrow(schema, req.query);
    next();
  };
}
