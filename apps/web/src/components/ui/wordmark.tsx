import { cn } from '@/lib/cn';

/** The Stringfield mark and the name in Space Grotesk. */
export function Wordmark({ className, isCompact = false }: { className?: string; isCompact?: boolean }) {
  return (
    <span className={cn('inline-flex items-center gap-2.5 font-display font-bold tracking-tight', className)}>
      {/* A series string snaking across its rows, an S for Stringfield; copper dots are its + and − ends. */}
      <svg viewBox="0 0 32 32" aria-hidden="true" className={cn('shrink-0', isCompact ? 'size-7' : 'size-9')}>
        <rect width="32" height="32" rx="7" fill="currentColor" fillOpacity="0.14" />
        <path d="M24 8.5H10.5a3.75 3.75 0 0 0 0 7.5h11a3.75 3.75 0 0 1 0 7.5H8" fill="none" stroke="currentColor" strokeWidth="2.6" strokeLinecap="round" />
        <circle cx="24.5" cy="8.5" r="3" className="fill-copper-soft stroke-copper-line" strokeWidth="1.6" />
        <circle cx="7.5" cy="23.5" r="3" className="fill-copper-soft stroke-copper-line" strokeWidth="1.6" />
      </svg>
      <span className={isCompact ? 'text-xl' : 'text-2xl'}>Stringfield</span>
    </span>
  );
}
