import type { WorkCenterDetail } from '@millrace/contracts';
import { Caution } from '@/components/ui/caution';
import { Form } from '@/components/ui/form';
import { useUpdateWorkCenter, workCenterUpdateSchema, type WorkCenterUpdate } from '../api/update-work-center';
import { WorkCenterFields } from './work-center-fields';

export function toWorkCenterValues(w: WorkCenterDetail): WorkCenterUpdate {
  return {
    code: w.code,
    name: w.name,
    efficiency: w.efficiency,
    overtimeCapHoursPerWeek: w.overtimeCapHoursPerWeek,
    overtimeCostPerHour: w.overtimeCostPerHour,
    shiftPattern: { ...w.shiftPattern, shiftStarts: [...w.shiftPattern.shiftStarts] },
    version: w.version,
  };
}

export function WorkCenterDetailsForm({ workCenter, readOnly, reload }: { workCenter: WorkCenterDetail; readOnly: boolean; reload: () => Promise<WorkCenterDetail> }) {
  const update = useUpdateWorkCenter();
  return (
    <Form
      label={`Work center ${workCenter.code}`}
      schema={workCenterUpdateSchema}
      defaultValues={toWorkCenterValues(workCenter)}
      readOnly={readOnly}
      submitLabel="Save work center"
      onSubmit={async (values) => {
        await update.mutateAsync({ id: workCenter.id, body: values });
        return toWorkCenterValues(await reload());
      }}
      onReload={async () => toWorkCenterValues(await reload())}
    >
      <WorkCenterFields />
      <Caution title="Overtime and machine limits">
        The overtime cap and the shift pattern are planning limits, not permissions. Keep them within the machine maker's rated
        capacity and maintenance intervals, your working-time agreements and local labour law.
      </Caution>
    </Form>
  );
}
