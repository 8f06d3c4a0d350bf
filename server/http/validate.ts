import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { badRequest } from './httpError';

/** Lists zod issues as "field: problem" pairs a person can read. */
export function describeIssues(issues: z.core.$ZodIssue[]): { path: string; message: string }[] {
  return issues.map((issue) => ({
    path: issue.path.length ? issue.path.join('.') : '(body)',
    message: issue.message,
  }));
}

/** The value as `schema` reads it (parsed and stripped), or a 400 naming each problem in words. */
export function checkedBody<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const fields = describeIssues(result.error.issues);
  const summary = fields.map((f) => `${f.path}: ${f.message}`).join('; ');
  throw badRequest(`The request was not accepted. ${summary}`, fields);
}

/**
 * The single place request bodies are checked (`checkedBody`): the parsed (and stripped) body
 * replaces the raw one, so a route handler only ever sees data that matches the shared schema.
 */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req, _res, next) => {
    try {
      req.body = checkedBody(schema, req.body);
      next();
    } catch (error) {
      next(error);
    }
  };
}
