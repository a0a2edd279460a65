import { zodResolver } from '@hookform/resolvers/zod';
import { resetRequestInputSchema, type ResetRequestInput } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

const fieldNames = ['email'] as const;

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    formState: { errors },
  } = useForm<ResetRequestInput>({ resolver: zodResolver(resetRequestInputSchema), defaultValues: { email: '' } });

  const onSubmit = handleSubmit((values) => {
    request.mutate(values, {
      onError: (error) => {
        const split = splitServerErrors(error, fieldNames);
        for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message });
        if (split.formError) setError('root', { type: 'server', message: split.formError });
      },
    });
  });

  if (request.isSuccess) {
    return (
      <Alert tone="pass" title="Check your e-mail">
        <p>
          If <strong className="break-all">{getValues('email')}</strong> belongs to a Stringfield account, a link to choose a new password is on its
          way. The link works once and expires; it may take a minute to arrive.
        </p>
      </Alert>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div aria-live="assertive" className="empty:hidden">{errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}</div>
      <FormField label="E-mail" hint="The address you sign in with." error={errors.email?.message}>
        <Input type="email" autoComplete="email" inputMode="email" autoCapitalize="none" spellCheck={false} {...register('email')} />
      </FormField>
      <Button type="submit" variant="primary" size="lg" isFullWidth isPending={request.isPending}>
        {request.isPending ? 'Sending…' : 'Send reset link'}
      </Button>
    </form>
  );
}
