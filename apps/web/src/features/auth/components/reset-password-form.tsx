import { zodResolver } from '@hookform/resolvers/zod';
import { resetInputSchema } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { splitServerErrors } from '@/lib/form-errors';
import { useResetPassword } from '../api/reset-password';

/* The server's password rule, plus a second entry so a gloved typo doesn't lock someone out. */
const resetFormSchema = z
  .object({
    password: resetInputSchema.shape.password,
    confirmPassword: z.string().min(1, 'Type the password a second time'),
  })
  .refine((v) => v.password === v.confirmPassword, { path: ['confirmPassword'], message: 'The two passwords do not match' });
type ResetForm = z.infer<typeof resetFormSchema>;

const fieldNames = ['password', 'confirmPassword'] as const;

export function ResetPasswordForm({
  token,
  isInvite,
  onDone,
  requestNewLink,
}: {
  token: string;
  isInvite: boolean;
  onDone: (message: string) => void;
  /** Rendered when the token turns out expired or used. */
  requestNewLink: ReactNode;
}) {
  const reset = useResetPassword();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ResetForm>({ resolver: zodResolver(resetFormSchema), defaultValues: { password: '', confirmPassword: '' } });

  const onSubmit = handleSubmit(({ password }) => {
    reset.mutate(
      { token, password },
      {
        onSuccess: onDone,
        onError: (error) => {
          const split = splitServerErrors(error, fieldNames);
          for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
          if (split.formError) setError('root', { type: 'server', message: split.formError });
        },
      },
    );
  });

  // A 400 without a password complaint means the link itself is no good (expired or already used).
  const isLinkProblem = isApiError(reset.error) && reset.error.status === 400 && !reset.error.fields?.password;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? (
          <Alert tone="fail" title={isLinkProblem ? 'This link no longer works' : undefined}>
            <p>{errors.root.message}</p>
            {isLinkProblem ? <div className="mt-2">{requestNewLink}</div> : null}
          </Alert>
        ) : null}
      </div>
      <FormField
        label={isInvite ? 'Choose a password' : 'New password'}
        hint="At least 12 characters. A short sentence you can type with gloves off is fine."
        error={errors.password?.message}
      >
        <Input type="password" autoComplete="new-password" {...register('password')} />
      </FormField>
      <FormField label="Type it again" error={errors.confirmPassword?.message}>
        <Input type="password" autoComplete="new-password" {...register('confirmPassword')} />
      </FormField>
      <Button type="submit" variant="primary" size="lg" isFullWidth isPending={reset.isPending}>
        {reset.isPending ? 'Saving…' : isInvite ? 'Set password and join' : 'Save new password'}
      </Button>
    </form>
  );
}
