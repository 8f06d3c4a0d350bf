import { useCallback, useLayoutEffect, useRef } from 'react';

/**
 * A callback whose identity never changes but that always runs the latest `fn`: a memoized
 * child handed it (the keypad) is not drawn again on every tap because its handler is new.
 */
export function useSteadyCallback<A extends unknown[]>(fn: (...args: A) => void): (...args: A) => void {
  const latest = useRef(fn);
  // Set after each commit; a tap always comes after the commit of what it sees.
  useLayoutEffect(() => {
    latest.current = fn;
  });
  return useCallback((...args: A) => latest.current(...args), []);
}
