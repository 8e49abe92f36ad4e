import { useNavigate } from 'react-router-dom';
import { Form } from '@/components/ui/form';
import { paths } from '@/config/paths';
import { useCreateWorkCenter, workCenterCreateSchema } from '../api/create-work-center';
import { WorkCenterFields } from './work-center-fields';

export function WorkCenterCreateForm() {
  const create = useCreateWorkCenter();
  const navigate = useNavigate();
  return (
    <Form
      label="New work center"
      schema={workCenterCreateSchema}
      defaultValues={{
        code: '',
        name: '',
        efficiency: 0.85,
        overtimeCapHoursPerWeek: null,
        overtimeCostPerHour: 0,
        shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00'] },
      }}
      submitLabel="Create work center"
      savedMessage="Created."
      onSubmit={async (values) => {
        const wc = await create.mutateAsync(values);
        void navigate(paths.workCenter.getHref(wc.id));
      }}
    >
      <WorkCenterFields />
    </Form>
  );
}
