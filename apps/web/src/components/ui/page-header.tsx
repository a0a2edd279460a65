import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

/** The one h1 of a page, an optional line under it and the page's main actions. */
export function PageHeader({ title, description, actions, eyebrow, className }: { title: string; description?: ReactNode; actions?: ReactNode; eyebrow?: ReactNode; className?: string }) {
  return (
    <header className={cn('mb-6 flex flex-col gap-4 sm:flex-row sm:items-end sm:justify-between', className)}>
      <div className="min-w-0">
        {eyebrow ? <p className="mb-1 text-sm font-semibold tracking-wide text-brand uppercase">{eyebrow}</p> : null}
        <h1 className="text-2xl font-bold text-ink sm:text-3xl">{title}</h1>
        {description ? <div className="mt-2 max-w-prose text-ink-muted">{description}</div> : null}
      </div>
      {actions ? <div className="flex shrink-0 flex-wrap gap-3">{actions}</div> : null}
    </header>
  );
}
