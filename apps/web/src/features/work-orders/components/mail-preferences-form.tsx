import { mailCategories, mailCategoryLabels, mailPreferencesSchema } from '@stringfield/shared';
import { useState } from 'react';
import { toast } from '@/lib/toast';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { useMailPreferences } from '../api/get-mail-preferences';
import { useUpdateMailPreferences, type MailPreferences } from '../api/update-mail-preferences';

type Category = (typeof mailCategories)[number];

const hints: Record<Category, string> = {
  assignment: 'Sent to technicians when a dispatcher gives them a ticket.',
  submission: 'Sent to supervisors when a technician finishes the work.',
  return: 'Sent to technicians when a supervisor sends work back.',
  overdue: 'Sent when a ticket passes its deadline.',
};

function Form({ initial }: { initial: MailPreferences }) {
  const update = useUpdateMailPreferences();
  const [optOut, setOptOut] = useState<Category[]>(initial.optOut);
  const isDirty = optOut.length !== initial.optOut.length || optOut.some((c) => !initial.optOut.includes(c));

  return (
    <form
      className="flex flex-col gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        const body = mailPreferencesSchema.parse({ optOut });
        update.mutate(body, {
          onSuccess: () => toast.success('Mail settings saved'),
          onError: (error) => toast.error('Mail settings were not saved', { description: error.message }),
        });
      }}
    >
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-2 text-ink-muted">Send me an e-mail when…</legend>
        {mailCategories.map((category) => (
          <Checkbox
            key={category}
            label={mailCategoryLabels[category]}
            hint={hints[category]}
            checked={!optOut.includes(category)}
            onChange={(event) =>
              setOptOut((current) =>
                event.target.checked ? current.filter((c) => c !== category) : [...current, category],
              )
            }
          />
        ))}
      </fieldset>
      <div>
        <Button
          type="submit"
          variant="primary"
          isPending={update.isPending}
          disabled={!isDirty || update.isPending}
          className="w-full sm:w-auto"
        >
          Save mail settings
        </Button>
      </div>
    </form>
  );
}

/** Which work-order e-mails the signed-in person gets; each category on or off. */
export function MailPreferencesForm() {
  const prefs = useMailPreferences();
  if (prefs.isPending) {
    return (
      <LoadingRegion label="Loading mail settings" className="flex flex-col gap-3">
        {mailCategories.map((c) => (
          <Skeleton key={c} className="h-touch" />
        ))}
      </LoadingRegion>
    );
  }
  if (prefs.isError)
    return (
      <ErrorState
        title="Mail settings did not load"
        error={prefs.error}
        onRetry={() => void prefs.refetch()}
        isRetrying={prefs.isFetching}
      />
    );
  // Remount when the saved state changes, so the form starts from what the server holds.
  return <Form key={prefs.data.optOut.join(',')} initial={prefs.data} />;
}
