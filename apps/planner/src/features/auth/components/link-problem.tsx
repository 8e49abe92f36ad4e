import { Link } from 'react-router-dom';
import type { PersonTokenPurpose } from '@millrace/contracts';
import { paths } from '@/config/paths';

/**
 * An e-mailed link that cannot be used: expired, used already, or not a link we sent. The API
 * does not say which (it would tell a stranger whether a link was ever real), so neither do we.
 */
export function LinkProblem({ purpose }: { purpose: PersonTokenPurpose }) {
  return (
    <div role="alert" className="flex flex-col gap-3 rounded border border-fault-700 bg-fault-50 p-4">
      <p className="font-semibold text-fault-700">
        <span aria-hidden="true">✕ </span>This link can no longer be used
      </p>
      <p>
        Links in Millrace e-mails work once and expire after a while. This one has expired, has already been used, or was
        copied incompletely.
      </p>
      {purpose === 'invitation' ? (
        <p>Ask your Millrace admin to send you a new invitation. If you already chose a password, sign in with it.</p>
      ) : (
        <p>
          <Link className="underline" to={paths.forgotPassword.getHref()}>
            Ask for a new link
          </Link>{' '}
          to choose a new password.
        </p>
      )}
      <p>
        <Link className="underline" to={paths.signIn.getHref()}>
          Go to sign-in
        </Link>
      </p>
    </div>
  );
}
