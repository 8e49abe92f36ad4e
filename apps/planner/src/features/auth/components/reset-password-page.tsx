import { useState } from 'react';
import { Link } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useLinkInfo } from '../api/get-link-info';
import { AuthCard } from './auth-card';
import { LinkProblem } from './link-problem';
import { SetPasswordForm, type LinkOutcome } from './set-password-form';

/** /reset-password?token= — the reset e-mail's link: choose a new password; every session ends. */
export function ResetPasswordPage({ token }: { token: string }) {
  const info = useLinkInfo('password_reset', token);
  const [step, setStep] = useState<{ kind: 'choosing' } | LinkOutcome>({ kind: 'choosing' });

  if (token === '' || step.kind === 'link_unusable' || (isApiError(info.error) && (info.error.status === 400 || info.error.status === 404))) {
    return (
      <AuthCard title="Choose a new password">
        <LinkProblem purpose="password_reset" />
      </AuthCard>
    );
  }
  if (info.isPending) return <Loading label="Reading the link…" />;
  if (info.isError) {
    return (
      <AuthCard title="Choose a new password">
        <ErrorState error={info.error} onRetry={() => void info.refetch()} />
      </AuthCard>
    );
  }

  return (
    <AuthCard title="Choose a new password">
      {step.kind === 'password_set' ? (
        <div role="status" className="flex flex-col gap-2 rounded border border-fine-700 bg-fine-50 p-3">
          <p>
            <span aria-hidden="true">✓ </span>The password of {info.data.email} is changed. Every place where you were signed in has
            been signed out.
          </p>
          <p>
            <Link className="underline" to={paths.signIn.getHref()}>
              Sign in
            </Link>{' '}
            with the new password.
          </p>
        </div>
      ) : (
        <>
          <p className="mb-4">
            For <strong>{info.data.email}</strong>.
          </p>
          <SetPasswordForm purpose="password_reset" token={token} submitLabel="Set new password" onOutcome={setStep} />
        </>
      )}
    </AuthCard>
  );
}
