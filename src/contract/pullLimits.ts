/**
 * How many changes one pull answers: by default, and at most. Kept apart from the zod schemas so
 * the phone's sync code reads them without loading zod.
 */
export const PULL_LIMIT_DEFAULT = 500;
export const PULL_LIMIT_MAX = 2000;
