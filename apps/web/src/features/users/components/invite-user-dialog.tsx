import { zodResolver } from '@hookform/resolvers/zod';
import { inviteUserInputSchema, roleLabels, roles } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { splitServerErrors } from '@/lib/form-errors';
import { useInviteUser } from '../api/invite-user';

const fieldNames = ['email', 'name', 'role'] as const;

export function InviteUserDialog({ isOpen, onClose }: { isOpen: boolean; onClose: () => void }) {
  const invite = useInviteUser();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(inviteUserInputSchema),
    defaultValues: { email: '', name: '', role: 'technician' as const },
  });

  const close = () => {
    reset();
    invite.reset();
    onClose();
  };

  const onSubmit = handleSubmit((values) => {
    invite.mutate(values, {
      onSuccess: (user) => {
        toast.success(`Invitation sent to ${user.email}`, {
          description: `${user.name} joins as ${roleLabels[user.role].toLowerCase()} once they set a password.`,
        });
        close();
      },
      onError: (error) => {
        if (isApiError(error) && error.status === 409) {
          setError('email', { type: 'server', message: 'Someone already has an account with this e-mail address.' }, { shouldFocus: true });
          return;
        }
        const split = splitServerErrors(error, fieldNames);
        for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
        if (split.formError) setError('root', { type: 'server', message: split.formError });
      },
    });
  });

  return (
    <Dialog
      isOpen={isOpen}
      onClose={close}
      title="Invite a person"
      description="They get an e-mail with a link to choose their password, then they can sign in."
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
        <div aria-live="assertive" className="empty:hidden">{errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}</div>
        <FormField label="Full name" error={errors.name?.message}>
          <Input autoComplete="off" {...register('name')} />
        </FormField>
        <FormField label="E-mail" error={errors.email?.message}>
          <Input type="email" inputMode="email" autoCapitalize="none" spellCheck={false} autoComplete="off" {...register('email')} />
        </FormField>
        <FormField label="Role" hint="What they may see and do. You can change it later." error={errors.role?.message}>
          <Select {...register('role')}>
            {roles.map((role) => (
              <option key={role} value={role}>
                {roleLabels[role]}
              </option>
            ))}
          </Select>
        </FormField>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={close} disabled={invite.isPending}>
            Cancel
          </Button>
          <Button type="submit" variant="primary" isPending={invite.isPending}>
            {invite.isPending ? 'Sending invitation…' : 'Send invitation'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
