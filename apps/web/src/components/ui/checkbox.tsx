import type { ComponentProps, ReactNode } from 'react';
import { cn } from '@/lib/cn';

/** A checkbox and its label as one 48 px target. */
export function Checkbox({
  label,
  hint,
  className,
  ...props
}: Omit<ComponentProps<'input'>, 'type'> & { label: ReactNode; hint?: ReactNode }) {
  return (
    <label
      className={cn(
        'flex min-h-touch cursor-pointer items-center gap-3 rounded-control px-1 py-1.5',
        className,
      )}
    >
      <input type="checkbox" className="size-6 shrink-0 accent-brand" {...props} />
      <span className="min-w-0">
        <span className="block text-ink">{label}</span>
        {hint ? <span className="block text-sm text-ink-muted">{hint}</span> : null}
      </span>
    </label>
  );
}
