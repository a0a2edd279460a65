import { clsx, type ClassValue } from 'clsx';

/** Joins class names, dropping falsy ones: `cn('px-4', isActive && 'bg-brand')`. */
export function cn(...inputs: ClassValue[]): string {
  return clsx(inputs);
}
