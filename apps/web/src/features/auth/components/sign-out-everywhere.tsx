import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/dialog';
import { useSignOutEverywhere } from '../api/sign-out';

/** Settings: end every session of this person, on every phone and computer. */
export function SignOutEverywhere() {
  const [isAsking, setIsAsking] = useState(false);
  const mutation = useSignOutEverywhere();
  return (
    <div className="flex flex-col gap-3">
      {mutation.isError ? (
        <Alert tone="fail" title="Nothing was signed out">
          {mutation.error.message}
        </Alert>
      ) : null}
      <div>
        <Button variant="secondary" onClick={() => setIsAsking(true)}>
          Sign out everywhere
        </Button>
      </div>
      <ConfirmDialog
        isOpen={isAsking}
        onClose={() => setIsAsking(false)}
        onConfirm={() => mutation.mutate()}
        isPending={mutation.isPending}
        title="Sign out on every device?"
        description="Every phone and computer signed in as you is signed out, this one too. Readings waiting on a phone stay on that phone and are sent once you sign in there again."
        confirmLabel="Sign out everywhere"
      />
    </div>
  );
}
