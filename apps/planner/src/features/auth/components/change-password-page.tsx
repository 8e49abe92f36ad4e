import { z } from 'zod';
import { passwordChangeSchema } from '@millrace/contracts';
import { Form, FormInput } from '@/components/ui/form';
import { PageHeader } from '@/components/ui/page-header';
import { useChangeOwnPassword } from '../api/change-own-password';
import { passwordPolicyHint } from './password-rules';

const changeTwiceSchema = passwordChangeSchema
  .extend({ repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { path: ['repeat'], message: 'The two entries differ; type the same password twice.' });

/** /account/password — every role changes its own password; the other sessions end, this one stays. */
export function ChangePasswordPage() {
  const change = useChangeOwnPassword();
  return (
    <>
      <PageHeader title="Change password" description="Changing it signs you out everywhere else; you stay signed in here." />
      <div className="max-w-md">
        <Form
          label="Change password"
          schema={changeTwiceSchema}
          defaultValues={{ currentPassword: '', newPassword: '', repeat: '' }}
          submitLabel="Change password"
          savedMessage="Password changed. Other sessions are signed out."
          onSubmit={async ({ currentPassword, newPassword }) => {
            await change.mutateAsync({ currentPassword, newPassword });
            return { currentPassword: '', newPassword: '', repeat: '' };
          }}
        >
          <FormInput name="currentPassword" label="Current password" type="password" autoComplete="current-password" />
          <FormInput name="newPassword" label="New password" type="password" autoComplete="new-password" hint={passwordPolicyHint} />
          <FormInput name="repeat" label="New password again" type="password" autoComplete="new-password" />
        </Form>
      </div>
    </>
  );
}
