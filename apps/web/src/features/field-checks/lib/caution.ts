import { localDay } from './format';

const KEY = 'stringfield:dc-caution-acknowledged';

type StorageLike = Pick<Storage, 'getItem' | 'setItem'>;

function storage(): StorageLike | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

/**
 * Whether this person acknowledged the DC safety caution today (local day). Kept per person, so a
 * shared phone asks each technician once a day.
 */
export function isCautionAcknowledged(userId: number, day = localDay(), store: StorageLike | null = storage()): boolean {
  return store?.getItem(`${KEY}:${userId}`) === day;
}

export function acknowledgeCaution(userId: number, day = localDay(), store: StorageLike | null = storage()): void {
  try {
    store?.setItem(`${KEY}:${userId}`, day);
  } catch {
    // Private mode or full storage: the caution simply shows again next time.
  }
}
