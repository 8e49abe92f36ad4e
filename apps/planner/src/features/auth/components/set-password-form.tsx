import type { PersonTokenPurpose } from '@millrace/contracts';
import { Form, FormInput } from '@/components/ui/form';
import { isApiError } from '@/lib/api-client';
import { useSetPasswordWithLink } from '../api/set-password-with-link';
import { newPasswordTwiceSchema, passwordPolicyHint } from './password-rules';

/** The link's outcome for the page around the form. */
export type LinkOutcome = { kind: 'password_set'; password: string } | { kind: 'link_unusable' };

/**
 * Chooses a password through an e-mailed link. The policy's refusals (too short, common, the
 * e-mail itself) come back from the API on the field `password` and are shown there.
 */
export function SetPasswordForm({
  purpose,
  token,
  submitLabel,
  onOutcome,
}: {
  purpose: PersonTokenPurpose;
  token: string;
  submitLabel: string;
  onOutcome: (outcome: LinkOutcome) => void;
}) {
  const setPassword = useSetPasswordWithLink(purpose);
  return (
    <Form
      label="Choose a password"
      schema={newPasswordTwiceSchema}
      defaultValues={{ password: '', repeat: '' }}
      submitLabel={submitLabel}
      savedMessage="Password set."
      onSubmit={async ({ password }) => {
        try {
          await setPassword.mutateAsync({ token, password });
        } catch (error) {
          if (isApiError(error) && error.fields.some((f) => f.path === 'token')) {
            onOutcome({ kind: 'link_unusable' });
            return;
          }
          throw error;
        }
        onOutcome({ kind: 'password_set', password });
      }}
    >
      <FormInput name="password" label="New password" type="password" autoComplete="new-password" hint={passwordPolicyHint} />
      <FormInput name="repeat" label="New password again" type="password" autoComplete="new-password" />
    </Form>
  );
}
