import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

/** A grey placeholder block in the shape of content that is on its way. */
export function Skeleton({ className }: { className?: string }) {
  return <div aria-hidden="true" className={cn('animate-shimmer rounded-control bg-line', className)} />;
}

/** Wraps skeletons so assistive technology hears one "Loading …" instead of a pile of empty boxes. */
export function LoadingRegion({ label, children, className }: { label: string; children: ReactNode; className?: string }) {
  return (
    <div role="status" aria-live="polite" className={className}>
      <span className="sr-only">{label}</span>
      {children}
    </div>
  );
}
