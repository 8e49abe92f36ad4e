import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useSignIn } from '@/lib/auth';
import { roleLabels } from '@/lib/authorization';
import { formatDateTime } from '@/lib/format';
import { useLinkInfo } from '../api/get-link-info';
import { AuthCard } from './auth-card';
import { LinkProblem } from './link-problem';
import { SetPasswordForm, type LinkOutcome } from './set-password-form';

type Step = { kind: 'choosing' } | LinkOutcome | { kind: 'signed_in_elsewhere' };

/** /welcome?token= — the invitation e-mail's link: who is invited, in which role; choose a password, then in. */
export function WelcomePage({ token }: { token: string }) {
  const info = useLinkInfo('invitation', token);
  const signIn = useSignIn();
  const navigate = useNavigate();
  const [step, setStep] = useState<Step>({ kind: 'choosing' });

  const linkRefused = token === '' || step.kind === 'link_unusable' || (isApiError(info.error) && (info.error.status === 400 || info.error.status === 404));
  if (linkRefused) {
    return (
      <AuthCard title="Invitation">
        <LinkProblem purpose="invitation" />
      </AuthCard>
    );
  }
  if (info.isPending) return <Loading label="Reading the invitation…" />;
  if (info.isError) {
    return (
      <AuthCard title="Invitation">
        <ErrorState error={info.error} onRetry={() => void info.refetch()} />
      </AuthCard>
    );
  }

  const onOutcome = (outcome: LinkOutcome) => {
    setStep(outcome);
    if (outcome.kind !== 'password_set') return;
    signIn.mutate(
      { email: info.data.email, password: outcome.password },
      {
        onSuccess: () => void navigate(paths.home.getHref(), { replace: true }),
        onError: () => setStep({ kind: 'signed_in_elsewhere' }),
      },
    );
  };

  return (
    <AuthCard title={`Welcome, ${info.data.name}`}>
      <p className="mb-2">
        You are invited to Millrace as <strong>{roleLabels[info.data.role]}</strong>. You will sign in with{' '}
        <strong>{info.data.email}</strong>.
      </p>
      <p className="mb-4 text-sm text-ink-soft">This link works once, until {formatDateTime(info.data.expiresAt)}.</p>
      {step.kind === 'choosing' ? <SetPasswordForm purpose="invitation" token={token} submitLabel="Set password and sign in" onOutcome={onOutcome} /> : null}
      {step.kind === 'password_set' ? <Loading label="Signing you in…" /> : null}
      {step.kind === 'signed_in_elsewhere' ? (
        <div role="status" className="rounded border border-fine-700 bg-fine-50 p-3">
          <p>
            <span aria-hidden="true">✓ </span>Your password is set.
          </p>
          <p>
            <Link className="underline" to={paths.signIn.getHref()}>
              Sign in
            </Link>{' '}
            with {info.data.email} and the password you just chose.
          </p>
        </div>
      ) : null}
    </AuthCard>
  );
}
