import { useState } from 'react';
import { useLiveQuery } from 'dexie-react-hooks';
import { newPadMemory, readPad, type PadData } from './padRead';
import { readAheadFor } from './padReadAhead';

export type { PadData } from './padRead';

/** Everything the pad shows for one joined target, live from IndexedDB (works offline). */
export function usePadData(
  sessionId: number,
  targetNumber: number,
  userId: number | undefined,
): PadData | null | undefined {
  const key = { sessionId, targetNumber, userId };
  // Opened on the pad, its first read was started as the app loaded (padReadAhead): the pad is
  // drawn from it at once, and the live read that follows shares its memory, so what reads the
  // same is not drawn again.
  const [ahead] = useState(() => readAheadFor(key));
  const [memory] = useState(() => ahead?.memory ?? newPadMemory());
  return useLiveQuery(() => readPad(key, memory), [sessionId, targetNumber, userId], ahead?.data);
}
