import { roleLabels, roles, type Role, type User } from '@stringfield/shared';
import { useState } from 'react';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Select } from '@/components/ui/form-field';
import { useUpdateUser } from '../api/update-user';
import { UserStatusBadge } from './user-status-badge';

/**
 * Change a person's role, or switch their access off and on again. Access changes ask first:
 * deactivating signs the person out of every device at once.
 */
export function ManageUserDialog({ user, currentUserId, onClose }: { user: User | null; currentUserId: number | undefined; onClose: () => void }) {
  return (
    <Dialog isOpen={user !== null} onClose={onClose} title={user ? user.name : 'Person'} description={user ? user.email : undefined}>
      {/* Keyed so each person starts with a fresh form. */}
      {user ? <ManageUserBody key={user.id} user={user} isSelf={user.id === currentUserId} onClose={onClose} /> : null}
    </Dialog>
  );
}

function ManageUserBody({ user, isSelf, onClose }: { user: User; isSelf: boolean; onClose: () => void }) {
  const update = useUpdateUser();
  const [role, setRole] = useState<Role>(user.role);
  const [isConfirming, setIsConfirming] = useState(false);
  const [pendingChange, setPendingChange] = useState<'role' | 'access' | null>(null);

  const saveRole = () => {
    setPendingChange('role');
    update.mutate(
      { id: user.id, changes: { role } },
      {
        onSuccess: (saved) => {
          toast.success(`${saved.name} is now ${roleLabels[saved.role].toLowerCase()}`);
          onClose();
        },
      },
    );
  };

  const setAccess = (isActive: boolean) => {
    setPendingChange('access');
    update.mutate(
      { id: user.id, changes: { isActive } },
      {
        onSuccess: (saved) => {
          toast.success(saved.isActive ? `${saved.name} can sign in again` : `${saved.name} is deactivated and signed out everywhere`);
          onClose();
        },
      },
    );
  };

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-2">
        <UserStatusBadge user={user} />
        <span className="text-ink-muted">{roleLabels[user.role]}</span>
      </div>

      <div aria-live="assertive" className="empty:hidden">
        {update.error ? (
          <Alert tone="fail" title="That change was not saved">
            {update.error.message}
          </Alert>
        ) : null}
      </div>

      {isSelf ? (
        <Alert tone="info" title="This is your own account">
          To keep at least one administrator able to sign in, another administrator has to change your role or access.
        </Alert>
      ) : (
        <>
          <section aria-label="Role" className="flex flex-col gap-3">
            <FormField label={<span className="text-lg">Role</span>} hint="Takes effect the next time their page loads.">
              <Select value={role} onChange={(event) => setRole(event.target.value as Role)}>
                {roles.map((option) => (
                  <option key={option} value={option}>
                    {roleLabels[option]}
                  </option>
                ))}
              </Select>
            </FormField>
            <Button
              variant="primary"
              className="self-start"
              onClick={saveRole}
              disabled={role === user.role || update.isPending}
              isPending={update.isPending && pendingChange === 'role'}
            >
              Save role
            </Button>
          </section>

          <section aria-labelledby="manage-access" className="flex flex-col gap-3 border-t border-line pt-5">
            <h3 id="manage-access" className="text-lg font-semibold">
              Access
            </h3>
            {isConfirming ? (
              <div className="rounded-control border-2 border-fail/40 bg-fail-soft p-4" role="group" aria-labelledby="confirm-access">
                <p id="confirm-access" className="font-semibold">
                  {user.isActive ? `Deactivate ${user.name}?` : `Reactivate ${user.name}?`}
                </p>
                <p className="mt-1 text-ink">
                  {user.isActive
                    ? 'They are signed out of every device straight away and cannot sign in until an administrator reactivates them.'
                    : 'They can sign in again with their existing password.'}
                </p>
                <div className="mt-4 flex flex-col-reverse gap-3 sm:flex-row">
                  <Button variant="secondary" onClick={() => setIsConfirming(false)} disabled={update.isPending}>
                    Keep as it is
                  </Button>
                  <Button
                    variant={user.isActive ? 'danger' : 'primary'}
                    onClick={() => setAccess(!user.isActive)}
                    isPending={update.isPending && pendingChange === 'access'}
                  >
                    {user.isActive ? 'Yes, deactivate' : 'Yes, reactivate'}
                  </Button>
                </div>
              </div>
            ) : (
              <>
                <p className="text-ink-muted">
                  {user.isActive ? 'Deactivating keeps their history but stops them signing in.' : 'This account is switched off.'}
                </p>
                <Button variant={user.isActive ? 'danger' : 'secondary'} className="self-start" onClick={() => setIsConfirming(true)} disabled={update.isPending}>
                  {user.isActive ? 'Deactivate…' : 'Reactivate…'}
                </Button>
              </>
            )}
          </section>
        </>
      )}
    </div>
  );
}
