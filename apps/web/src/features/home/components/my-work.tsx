import type { SessionUser } from '@stringfield/shared';
import { format } from 'date-fns';
import { EmptyState } from '@/components/ui/empty-state';
import { FieldSafetyCard } from './field-safety-card';

/** A field technician's home: today's work first (none yet), the safety card always beneath it. */
export function MyWork({ user }: { user: SessionUser }) {
  const firstName = user.name.split(/\s+/)[0] ?? user.name;
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-6">
      <header>
        <p className="text-sm font-semibold tracking-wide text-brand uppercase">{format(new Date(), 'EEEE d MMMM')}</p>
        <h1 className="text-2xl font-bold sm:text-3xl">My work</h1>
        <p className="mt-1 text-ink-muted">Hello {firstName}. Work orders assigned to you are listed here.</p>
      </header>
      <EmptyState
        icon="clipboard"
        title="No work orders assigned to you yet"
        description="When a dispatcher assigns you a faulty string, it appears here with the site, the string and what to check."
      />
      <FieldSafetyCard />
    </div>
  );
}
