import { permissions, roleLabels, type Action, type Role } from '@stringfield/shared';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/config/paths';

function listOf(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words.at(-1) ?? ''}`;
}

/** A page this role may not see: say so, say who can, and offer the way home. */
export function NotAllowed({ pageName, action, role }: { pageName: string; action: Action; role: Role }) {
  const allowed = (permissions[action] as readonly Role[]).map((r) => `${roleLabels[r].toLowerCase()}s`);
  return (
    <div className="mx-auto max-w-2xl pt-4">
      <h1 className="sr-only">{pageName}: not available</h1>
      <EmptyState
        icon="lock"
        title={`${pageName} is not available for your role`}
        description={
          <>
            <p>
              You are signed in as <strong className="text-ink">{roleLabels[role].toLowerCase()}</strong>. {pageName} is for {listOf(allowed)}.
            </p>
            <p className="mt-2">If you need it for your work, ask an administrator to change your role.</p>
          </>
        }
        action={
          <ButtonLink to={paths.home()} variant="brand">
            Go to Today
          </ButtonLink>
        }
      />
    </div>
  );
}
