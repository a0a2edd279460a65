import { useCallback, useSyncExternalStore } from 'react';

/**
 * Whether a CSS media query matches now, kept up to date as the window changes. For layouts that
 * differ by width in structure, not just style: rendering only the one on screen keeps the page's
 * DOM (and the work of building it) to what is seen. Use the same breakpoint as the Tailwind class
 * it stands for (`md:` is `(min-width: 48rem)`).
 */
export function useMediaQuery(query: string): boolean {
  const subscribe = useCallback(
    (onChange: () => void) => {
      const media = window.matchMedia(query);
      media.addEventListener('change', onChange);
      return () => media.removeEventListener('change', onChange);
    },
    [query],
  );
  return useSyncExternalStore(subscribe, () => window.matchMedia(query).matches);
}
