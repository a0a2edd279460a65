import { useSyncExternalStore } from 'react';

/* One timer for every clock on the page: a board of 50 tickets ticks once, not 50 times. */
const TICK_MS = 15_000;
let now = Date.now();
let timer: number | undefined;
const listeners = new Set<() => void>();

function subscribe(listener: () => void) {
  listeners.add(listener);
  if (timer === undefined) {
    now = Date.now();
    timer = window.setInterval(() => {
      now = Date.now();
      for (const l of listeners) l();
    }, TICK_MS);
  }
  return () => {
    listeners.delete(listener);
    if (listeners.size === 0 && timer !== undefined) {
      window.clearInterval(timer);
      timer = undefined;
    }
  };
}

/** The current time in ms, re-rendering every 15 s; SLA clocks show whole minutes, so that is plenty. */
export function useNow(): number {
  return useSyncExternalStore(subscribe, () => now);
}
