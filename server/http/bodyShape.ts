import type { RequestHandler } from 'express';
import { badRequest } from './httpError';

/** Deeper than any body of this API (a custom round is the deepest, at 4 levels). */
export const MAX_BODY_DEPTH = 16;

/**
 * Keys no body of this API has, which change how a value behaves when code turns it into text or
 * copies it (`{"toString": 1}` makes `String(value)` throw).
 */
const HOSTILE_KEYS = new Set(['toString', 'valueOf', 'toJSON', '__proto__', 'constructor', 'prototype']);

/** The first problem of a parsed JSON body's shape, or undefined. Iterative, so any depth is safe to look at. */
export function bodyShapeProblem(body: unknown): string | undefined {
  const stack: { value: unknown; depth: number }[] = [{ value: body, depth: 0 }];
  while (stack.length > 0) {
    const { value, depth } = stack.pop()!;
    if (typeof value !== 'object' || value === null) continue;
    if (depth >= MAX_BODY_DEPTH) return `The request nests data deeper than ${MAX_BODY_DEPTH} levels.`;
    for (const key of Object.keys(value)) {
      if (HOSTILE_KEYS.has(key)) return `The request holds a field named "${key}", which no request has.`;
      stack.push({ value: (value as Record<string, unknown>)[key], depth: depth + 1 });
    }
  }
  return undefined;
}

/**
 * Runs after the JSON parser, before any route: a body too deep or with a hostile key is a 400,
 * so no handler, rate limiter or schema ever turns such a value into text or recurses through it.
 */
export const checkBodyShape: RequestHandler = (req, _res, next) => {
  const problem = bodyShapeProblem(req.body);
  next(problem ? badRequest(`The request was not accepted. ${problem}`) : undefined);
};
