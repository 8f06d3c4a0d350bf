import { TASK_LABELS, type Task } from '../../../src/contract/fieldTerms';

export { TASK_LABELS };

/** Writer 1, writer 2 and the caller are one person each per target; any number may follow. */
export const isSingleHolderTask = (task: Task): boolean => task !== 'follower';

/** The order members are listed in a target package. */
export const TASK_ORDER: Record<Task, number> = { writer1: 0, writer2: 1, caller: 2, follower: 3 };

/** "writer 1", "the caller", "following" — the task inside a sentence. */
export function taskInSentence(task: Task): string {
  if (task === 'caller') return 'the caller';
  if (task === 'follower') return 'following';
  return TASK_LABELS[task].toLowerCase();
}
