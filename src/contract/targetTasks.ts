import { z } from 'zod';
import { TASKS, type Task } from './fieldTerms';

/**
 * An organizer or judge frees or reassigns a task on a target: `none` takes the person out of the
 * target's group; a task gives it to them (whoever kept it before then follows the target).
 */
export const setMemberTaskSchema = z.object({
  task: z.enum([...TASKS, 'none'], { error: 'Choose writer 1, writer 2, caller, following or none.' }),
});
export type SetMemberTaskInput = z.infer<typeof setMemberTaskSchema>;

/** `GET /api/events/:eventId/sessions/:sessionId/targets/:targetNumber/members`: the target's group. */
export type TargetMember = { userId: number; name: string; task: Task; joinedAt: string };
