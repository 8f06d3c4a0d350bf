import { useCallback, useState } from 'react';
import { messageOf } from '../api/request';

/**
 * Runs an action that records changes on this phone (settle, sign). Such screens show only what is
 * stored, so a failure would otherwise look like a tap that did nothing: it is kept as a message.
 */
export function useLocalSave(): { save: (action: () => Promise<unknown>) => void; problem?: string } {
  const [problem, setProblem] = useState<string>();
  const save = useCallback((action: () => Promise<unknown>) => {
    setProblem(undefined);
    action().catch((error: unknown) =>
      setProblem(`This was not saved on this phone (${messageOf(error)}). Try again.`),
    );
  }, []);
  return { save, problem };
}
