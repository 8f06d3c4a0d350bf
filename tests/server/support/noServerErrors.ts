import { afterAll, afterEach, expect, vi } from 'vitest';

/**
 * Hostile input is the sender's fault: after each test of the file, no server failure was logged
 * (the error handler logs only those).
 */
export function expectNoServerErrors(): void {
  const logged = vi.spyOn(console, 'error');
  afterEach(() => {
    expect(logged).not.toHaveBeenCalled();
    logged.mockClear();
  });
  afterAll(() => logged.mockRestore());
}
