import type { SessionUser } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { FieldSafetyCard } from './field-safety-card';

// "Wednesday 2 December". Intl rather than date-fns: this is a technician's first page, and every
// kilobyte of script counts on a phone at the edge of coverage. Made on first use, not at import: the
// first Intl formatter of a page loads the locale data (30–100 ms on a phone), which would lengthen
// whichever task happens to load this module.
let todayFormat: Intl.DateTimeFormat | undefined;
function formatToday(date: Date): string {
  todayFormat ??= new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long' });
  return todayFormat.format(date);
}

/**
 * A field technician's home: today's work first, the safety card always beneath it. The list itself
 * comes from the work-orders feature, composed in by the route.
 */
export function MyWork({ user, work }: { user: SessionUser; work?: ReactNode }) {
  const firstName = user.name.split(/\s+/)[0] ?? user.name;
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-6">
      <header>
        <p className="text-sm font-semibold tracking-wide text-brand uppercase">{formatToday(new Date())}</p>
        <h1 className="text-2xl font-bold sm:text-3xl">My work</h1>
        <p className="mt-1 text-ink-muted">
          Hello {firstName}. Your open work orders, the most urgent first.
        </p>
      </header>
      {work ?? (
        <EmptyState
          icon="clipboard"
          title="No work orders assigned to you yet"
          description="When a dispatcher assigns you a faulty string, it appears here with the site, the string and what to check."
        />
      )}
      <FieldSafetyCard />
    </div>
  );
}
