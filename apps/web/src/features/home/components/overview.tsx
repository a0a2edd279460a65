import { roleLabels, type Role, type SessionUser } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import type { IconName } from '@/components/ui/icon';

/* What each office role will find here once there is something to find. Honest, not a mock-up. */
const emptyByRole: Record<Exclude<Role, 'technician'>, { icon: IconName; title: string; description: string }> = {
  dispatcher: {
    icon: 'clipboard',
    title: 'No open work orders',
    description: 'Work orders opened on faulty DC strings will be listed here, with who is assigned and how long they have been open.',
  },
  supervisor: {
    icon: 'check',
    title: 'Nothing waiting for sign-off',
    description: 'Completed work orders that need your review and signature will appear here.',
  },
  owner: {
    icon: 'file',
    title: 'No close-out reports yet',
    description: 'When work on your sites is signed off, its close-out report will be here to read.',
  },
  admin: {
    icon: 'people',
    title: 'Nothing needs your attention',
    description: 'Invite the crew and set their roles to get started.',
  },
};

/** The home page of every role except technicians: who you are, and what is (not yet) here. */
export function Overview({ user, actions }: { user: SessionUser; actions?: ReactNode }) {
  const role = user.role === 'technician' ? 'dispatcher' : user.role;
  const empty = emptyByRole[role];
  return (
    <div className="mx-auto flex max-w-4xl flex-col gap-6">
      <header className="flex flex-col gap-1">
        <p className="text-sm font-semibold tracking-wide text-brand uppercase">Today</p>
        <h1 className="text-2xl font-bold sm:text-3xl">Hello, {user.name}</h1>
        <p className="text-ink-muted">
          Signed in as <strong className="text-ink">{roleLabels[user.role]}</strong>
          <span className="block [overflow-wrap:anywhere] sm:inline">
            <span aria-hidden="true" className="hidden sm:inline"> · </span>
            {user.email}
          </span>
        </p>
      </header>
      <EmptyState icon={empty.icon} title={empty.title} description={empty.description} action={actions} />
    </div>
  );
}
