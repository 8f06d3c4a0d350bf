/** Longest wait for a frame: a hidden page paints none, and the work must still run. */
const NO_FRAME_WAIT_MS = 100;

/**
 * Runs `work` once the browser has painted its next frame (a task after that frame's animation
 * callbacks), so what a tap changed reaches the screen before work the tap only set going:
 * screens re-reading the database, a sync starting.
 */
export function afterNextPaint(work: () => void): void {
  let ran = false;
  const once = () => {
    if (ran) return;
    ran = true;
    clearTimeout(fallback);
    work();
  };
  const fallback = setTimeout(once, NO_FRAME_WAIT_MS);
  if (typeof requestAnimationFrame === 'function') requestAnimationFrame(() => setTimeout(once, 0));
}
