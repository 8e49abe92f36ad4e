import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { signInSchema } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { useSignIn } from '@/lib/auth';

/** What the person reads when sign-in fails, by cause. */
export function signInFailureMessage(error: unknown): string {
  if (isApiError(error)) {
    if (error.status === 401) return 'The e-mail address or the password is not right. Check both and try again.';
    if (error.status === 429) {
      const wait = error.retryAfterSeconds;
      return wait
        ? `Too many sign-in attempts. Wait ${wait} second${wait === 1 ? '' : 's'} before trying again.`
        : 'Too many sign-in attempts. Wait a little before trying again.';
    }
    if (error.status === 403) return error.message || 'This account cannot sign in. Ask your admin.';
    return error.message;
  }
  return 'Sign-in failed for an unexpected reason. Try again.';
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useForm<z.input<typeof signInSchema>, unknown, z.output<typeof signInSchema>>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  const errors = form.formState.errors;

  const submit = form.handleSubmit((values) => {
    signIn.mutate(values, { onSuccess: onSignedIn });
  });

  return (
    <form aria-label="Sign in" noValidate onSubmit={submit} className="flex flex-col gap-4">
      {signIn.isError ? (
        <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-3 text-sm">
          <span aria-hidden="true">✕ </span>
          {signInFailureMessage(signIn.error)}
        </div>
      ) : null}
      <Input label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...form.register('email')} />
      <Input
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" variant="primary" busy={signIn.isPending} busyLabel="Signing in…" className="justify-center">
        Sign in
      </Button>
    </form>
  );
}
