import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Form, FormInput } from '@/components/ui/form';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { passwordResetRequestSchema, useRequestPasswordReset } from '../api/request-password-reset';
import { AuthCard } from './auth-card';

/**
 * The same words whatever the address: the page must not tell a stranger which addresses have an
 * account (the API answers 202 either way).
 */
export const resetRequestedText =
  'If this address belongs to an active Millrace account, an e-mail with a link to choose a new password is on its way. The link works once and expires; check your spam folder if nothing arrives within a few minutes.';

/** /forgot-password — asks for a reset link by e-mail. */
export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const [sentTo, setSentTo] = useState<string | null>(null);

  return (
    <AuthCard title="Forgot password">
      {sentTo === null ? (
        <>
          <p className="mb-4">Enter the e-mail address you sign in with. We send a link to choose a new password.</p>
          <Form
            label="Ask for a reset link"
            schema={passwordResetRequestSchema}
            defaultValues={{ email: '' }}
            submitLabel="Send link"
            onSubmit={async (values) => {
              try {
                await request.mutateAsync(values);
              } catch (error) {
                if (isApiError(error) && error.status === 429) {
                  const wait = error.retryAfterSeconds;
                  throw new Error(
                    wait
                      ? `Too many requests for a reset link. Wait ${Math.ceil(wait / 60)} minute${Math.ceil(wait / 60) === 1 ? '' : 's'} before asking again.`
                      : 'Too many requests for a reset link. Wait a while before asking again.',
                  );
                }
                throw error;
              }
              setSentTo(values.email);
            }}
          >
            <FormInput name="email" label="E-mail" type="email" autoComplete="username" />
          </Form>
        </>
      ) : (
        <p role="status" className="rounded border border-fine-700 bg-fine-50 p-3">
          <span aria-hidden="true">✓ </span>
          {resetRequestedText}
        </p>
      )}
      <p className="mt-4 text-sm">
        <Link className="underline" to={paths.signIn.getHref()}>
          Back to sign-in
        </Link>
      </p>
    </AuthCard>
  );
}
