import { useEffect, useState } from 'react';

/**
 * True once `isActive` has stayed true for `delayMs`, false as soon as it is false. A loading placeholder
 * drawn only then never flashes up for an answer that is nearly there (the first pages ask for their data
 * before they are drawn, so it usually is), and the page is not laid out twice for nothing.
 */
export function useAfterDelay(isActive: boolean, delayMs: number): boolean {
  const [isLate, setIsLate] = useState(false);
  useEffect(() => {
    if (!isActive) return;
    const timer = setTimeout(() => setIsLate(true), delayMs);
    return () => {
      clearTimeout(timer);
      setIsLate(false);
    };
  }, [isActive, delayMs]);
  return isActive && isLate;
}
