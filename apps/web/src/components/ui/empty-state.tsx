import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Icon, type IconName } from './icon';

/** What a person sees when there is honestly nothing here yet, and what (if anything) they can do about it. */
export function EmptyState({
  icon = 'inbox',
  title,
  description,
  action,
  className,
  headingLevel = 2,
}: {
  icon?: IconName;
  title: string;
  description?: ReactNode;
  action?: ReactNode;
  className?: string;
  headingLevel?: 2 | 3;
}) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <div className={cn('flex flex-col items-center rounded-card border-2 border-dashed border-edge/60 bg-surface/60 px-6 py-10 text-center', className)}>
      <span className="mb-4 grid size-16 place-items-center rounded-full bg-brand-soft text-brand">
        <Icon name={icon} className="size-8" />
      </span>
      <Heading className="text-xl font-semibold text-ink">{title}</Heading>
      {description ? <div className="mt-2 max-w-prose text-base text-ink-muted">{description}</div> : null}
      {action ? <div className="mt-6">{action}</div> : null}
    </div>
  );
}
