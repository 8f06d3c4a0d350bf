/**
 * The field's fixed words, kept free of zod so the pad can use them without loading the
 * validation library (the schemas in sync.ts build on these).
 */
export const ARROW_FLAGS = ['bounce-out', 'pass-through', 'missing', 'hanging', 'judge-needed'] as const;
export type ArrowFlag = (typeof ARROW_FLAGS)[number];

export const TASKS = ['writer1', 'writer2', 'caller', 'follower'] as const;
export type Task = (typeof TASKS)[number];

export type WriterSlot = 1 | 2;

/** Task names as people read them, on the phone and in the server's messages. */
export const TASK_LABELS: Record<Task, string> = {
  writer1: 'Writer 1',
  writer2: 'Writer 2',
  caller: 'Caller',
  follower: 'Following',
};
