/**
 * Runs `run` once the page has loaded, `delayMs` later and when the main thread is idle: for work no first
 * page needs (the toaster, the service worker), so that on a slow phone connection its downloads come after
 * the first page's code and data rather than beside them. Returns a function that cancels it.
 */
export function afterPageSettles(run: () => void, delayMs: number): () => void {
  let cancelled = false;
  let timer: ReturnType<typeof setTimeout> | undefined;
  const go = () => {
    if (cancelled) return;
    if ('requestIdleCallback' in window) window.requestIdleCallback(() => !cancelled && run(), { timeout: 2_000 });
    else run();
  };
  const wait = () => {
    timer = setTimeout(go, delayMs);
  };
  if (document.readyState === 'complete') wait();
  else window.addEventListener('load', wait, { once: true });
  return () => {
    cancelled = true;
    clearTimeout(timer);
    window.removeEventListener('load', wait);
  };
}

/** Resolves in a new task, so the browser may paint and handle input first (the start-up's steps, main.tsx). */
export function nextTask(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}
