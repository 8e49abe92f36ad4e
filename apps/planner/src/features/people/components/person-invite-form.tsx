import { useState } from 'react';
import { roles } from '@millrace/contracts';
import { Form, FormInput, FormSelect } from '@/components/ui/form';
import { roleLabels } from '@/lib/authorization';
import { formatDateTime } from '@/lib/format';
import { invitationCreateSchema, useInvitePerson } from '../api/invite-person';

const roleOptions = roles.map((r) => ({ value: r, label: roleLabels[r] }));

/** Invite by e-mail: the person chooses their own password through the link (it works once and expires). */
export function PersonInviteForm() {
  const invite = useInvitePerson();
  const [last, setLast] = useState<{ email: string; expiresAt: string } | null>(null);
  return (
    <>
      <Form
        label="Invite a person"
        schema={invitationCreateSchema}
        defaultValues={{ email: '', name: '', role: 'planner' }}
        submitLabel="Send invitation"
        savedMessage="Invitation sent."
        onSubmit={async (values) => {
          const sent = await invite.mutateAsync(values);
          setLast({ email: sent.email, expiresAt: sent.expiresAt });
          return { email: '', name: '', role: values.role };
        }}
      >
        <div className="grid grid-cols-3 gap-4">
          <FormInput name="email" label="E-mail" type="email" autoComplete="off" />
          <FormInput name="name" label="Name" />
          <FormSelect name="role" label="Role" options={roleOptions} />
        </div>
      </Form>
      {last ? (
        <p className="mt-2 text-sm">
          The last invitation went to {last.email}; its link works once, until {formatDateTime(last.expiresAt)}.
        </p>
      ) : null}
    </>
  );
}
