import type { ComponentProps } from 'react';
import { Input } from '@/components/ui/form-field';
import { cn } from '@/lib/cn';

/** A numeric field with its unit beside it; the decimal keypad opens on phones. */
export function UnitInput({ unit, className, ...props }: Omit<ComponentProps<typeof Input>, 'type' | 'inputMode'> & { unit: string }) {
  return (
    <div className="relative">
      <Input type="text" inputMode="decimal" autoComplete="off" spellCheck={false} className={cn('readings pr-16', className)} {...props} />
      <span aria-hidden="true" className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 text-sm font-semibold text-ink-muted">
        {unit}
      </span>
    </div>
  );
}
