import { roles } from '@millrace/contracts';
import { Form, FormInput, FormSelect } from '@/components/ui/form';
import { roleLabels } from '@/lib/authorization';
import { personCreateSchema, useCreatePerson } from '../api/create-person';

const roleOptions = roles.map((r) => ({ value: r, label: roleLabels[r] }));

export function PersonCreateForm() {
  const create = useCreatePerson();
  return (
    <Form
      label="Add a person"
      schema={personCreateSchema}
      defaultValues={{ email: '', name: '', role: 'planner', password: undefined }}
      submitLabel="Add person"
      savedMessage="Added."
      onSubmit={async (values) => {
        await create.mutateAsync({ ...values, password: values.password || undefined });
        return { email: '', name: '', role: values.role, password: undefined };
      }}
    >
      <div className="grid grid-cols-4 gap-4">
        <FormInput name="name" label="Name" />
        <FormInput name="email" label="E-mail" type="email" autoComplete="off" />
        <FormSelect name="role" label="Role" options={roleOptions} />
        <FormInput name="password" optional label="First password" type="password" autoComplete="new-password" hint="Optional. At least 12 characters; they change it after signing in." />
      </div>
    </Form>
  );
}
