/**
 * Runs `next` in a new task once the next frame has been painted (a frame callback, then a
 * timer from it), so work split into steps never holds up the page in one long task and each
 * step's result is on screen before the next begins. Returns a function that cancels it.
 */
export function afterNextPaint(next: () => void): () => void {
  let timer: number | null = null;
  const frame = requestAnimationFrame(() => {
    timer = window.setTimeout(next, 0);
  });
  return () => {
    cancelAnimationFrame(frame);
    if (timer !== null) window.clearTimeout(timer);
  };
}
