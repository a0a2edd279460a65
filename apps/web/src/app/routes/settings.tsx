import { can } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { SignOutEverywhere } from '@/features/auth/components/sign-out-everywhere';
import { MailPreferencesForm } from '@/features/work-orders/components/mail-preferences-form';
import { SlaPolicyEditor } from '@/features/work-orders/components/sla-policy-editor';
import { useSessionUser } from '../session';

function Panel({
  id,
  title,
  description,
  children,
}: {
  id: string;
  title: string;
  description: string;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id}>
      <Card className="flex flex-col gap-4 p-4 sm:p-6">
        <div>
          <h2 id={id} className="text-xl font-semibold">
            {title}
          </h2>
          <p className="text-ink-muted">{description}</p>
        </div>
        {children}
      </Card>
    </section>
  );
}

/** `/settings`: everyone's mail choices; for admins also the repair deadlines per site. */
export function SettingsRoute() {
  const user = useSessionUser();
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeader title="Settings" description={`For ${user.name} (${user.email}).`} className="mb-0" />
      <Panel
        id="mail-settings"
        title="E-mail"
        description="Work-order mail you want to get. Everything you can see is still on the board."
      >
        <MailPreferencesForm />
      </Panel>
      <Panel
        id="session-settings"
        title="Signed-in devices"
        description="Lost a phone, or left a shared computer signed in? End every session of yours at once."
      >
        <SignOutEverywhere />
      </Panel>
      {can(user.role, 'sla:manage') ? (
        <Panel
          id="sla-settings"
          title="Repair deadlines per site"
          description="Hours from report to repair for each priority. They set the due time of new tickets."
        >
          <SlaPolicyEditor />
        </Panel>
      ) : null}
    </div>
  );
}
