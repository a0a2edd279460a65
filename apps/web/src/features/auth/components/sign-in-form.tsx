import { zodResolver } from '@hookform/resolvers/zod';
import { loginInputSchema, type LoginInput, type SessionUser } from '@stringfield/shared';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input } from '@/components/ui/form-field';
import { paths } from '@/config/paths';
import { genericMessage, isApiError } from '@/lib/api-client';
import { splitServerErrors } from '@/lib/form-errors';
import { useSignIn } from '../api/sign-in';

const fieldNames = ['email', 'password'] as const;

/** Words for the refusals a person can act on; anything else shows the server's own message. */
function describeSignInError(error: unknown): { title: string; detail: string } | null {
  if (!isApiError(error)) return null;
  if (error.status === 401)
    return { title: 'E-mail or password not recognised', detail: 'Check both and try again. Passwords are case-sensitive.' };
  if (error.status === 403 && error.code === 'FORBIDDEN')
    return {
      title: 'This account is deactivated',
      detail: 'Your administrator has switched this account off. Ask them to reactivate it; resetting the password will not help.',
    };
  if (error.status === 429)
    return {
      title: 'Too many sign-in attempts',
      // The server says how long the pause lasts; keep its words when it sent some.
      detail: error.message && error.message !== genericMessage(429) ? error.message : 'For safety, sign-in is paused for a short while. Wait a few minutes, then try again.',
    };
  return null;
}

export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<{ title: string; detail: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<LoginInput>({
    resolver: zodResolver(loginInputSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    signIn.mutate(values, {
      onSuccess: onSignedIn,
      onError: (error) => {
        const known = describeSignInError(error);
        if (known) return setFormError(known);
        const split = splitServerErrors(error, fieldNames);
        for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
        if (split.formError) setFormError({ title: 'Sign-in did not work', detail: split.formError });
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div aria-live="assertive" className="empty:hidden">
        {formError ? (
          <Alert tone="fail" title={formError.title}>
            {formError.detail}
          </Alert>
        ) : null}
      </div>
      <FormField label="E-mail" error={errors.email?.message}>
        <Input type="email" autoComplete="username" inputMode="email" autoCapitalize="none" spellCheck={false} {...register('email')} />
      </FormField>
      <FormField label="Password" error={errors.password?.message}>
        <Input type="password" autoComplete="current-password" {...register('password')} />
      </FormField>
      <Button type="submit" variant="primary" size="lg" isFullWidth isPending={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="text-center">
        <Link to={paths.forgotPassword()} className="inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4 hover:text-brand-strong">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
