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

/**
 * The single place request bodies are checked: the parsed (and stripped) body replaces the raw one,
 * so a route handler only ever sees data that matches the shared schema.
 */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req, _res, next) => {
    const result = schema.safeParse(req.body ?? {});
    if (!result.success) {
      const fields = describeIssues(result.error.issues);
      const summary = fields.map((f) => `${f.path}: ${f.message}`).join('; ');
      next(badRequest(`The request was not accepted. ${summary}`, fields));
      return;
    }
    req.body = result.data;
    next();
  };
}
