import type { Task } from '../../contract/fieldTerms';

export { TASK_LABELS } from '../../contract/fieldTerms';

export const TASK_HINTS: Record<Task, string> = {
  writer1: 'You keep the first card: enter each value as it is called.',
  writer2: 'You keep the second card: enter each value as it is called.',
  caller: 'You call the values and settle any difference between the two cards.',
  follower: 'You follow the cards without writing.',
};
