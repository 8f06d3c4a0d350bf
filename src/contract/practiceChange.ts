import type { ChangeDto, PracticeChangeDto } from './sync';

/**
 * Whether a pulled change is of the person's own practice log. Apart from `sync.ts` (whose zod
 * schemas the phone's sync code must not import: they would join the pad's first load).
 */
export const isPracticeChange = (c: ChangeDto): c is PracticeChangeDto => c.type.startsWith('practice');
