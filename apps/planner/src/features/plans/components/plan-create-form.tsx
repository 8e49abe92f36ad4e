import { useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { planHorizonMaxWeeks, planHorizonMinWeeks } from '@millrace/contracts';
import { ErrorState } from '@/components/ui/error-state';
import { Form, FormCheckbox, FormInput, FormSelect } from '@/components/ui/form';
import { Loading } from '@/components/ui/loading';
import { paths } from '@/config/paths';
import { planCreateSchema, useCreatePlan } from '../api/create-plan';
import { useScenarios } from '../api/get-scenarios';

/** The contract's create schema; the scenario picker's "current data" choice is null on screen. */
const planCreateFormSchema = planCreateSchema.extend({
  scenarioId: planCreateSchema.shape.scenarioId.unwrap().nullable().optional(),
});

type PlanCreateFormValues = z.input<typeof planCreateFormSchema>;

const defaults: PlanCreateFormValues = {
  name: '',
  horizonWeeks: 12,
  scenarioId: null,
  smoothing: { enabled: false, weight: 1 },
  wholeUnits: true,
};

/**
 * A new plan version: name, horizon, scenario, smoothing and whole units. When the planning data
 * has issues the API answers 422 and the form lists every issue by item.
 */
export function PlanCreateForm() {
  const createPlan = useCreatePlan();
  const scenarios = useScenarios();
  const navigate = useNavigate();

  if (scenarios.isPending) return <Loading label="Loading scenarios…" />;
  if (scenarios.isError) return <ErrorState error={scenarios.error} onRetry={() => void scenarios.refetch()} />;

  return (
    <Form
      schema={planCreateFormSchema}
      defaultValues={defaults}
      label="New plan version"
      submitLabel="Create plan version"
      savedMessage="Plan version created."
      className="max-w-2xl"
      onSubmit={async ({ scenarioId, ...rest }) => {
        const plan = await createPlan.mutateAsync({ ...rest, ...(scenarioId ? { scenarioId } : {}) });
        void navigate(paths.plan.getHref(plan.id));
      }}
    >
      {(form) => {
        const smoothing = form.watch('smoothing.enabled');
        return (
          <>
            <FormInput name="name" label="Name" hint="Say what this version tries, e.g. “Spring peak, Saturday shift on the saw”." />
            <div className="grid grid-cols-2 gap-4">
              <FormInput
                name="horizonWeeks"
                label="Horizon (weeks)"
                number="number"
                hint={`From ${planHorizonMinWeeks} to ${planHorizonMaxWeeks} weeks.`}
              />
              <FormInput name="firstWeek" label="First week (optional)" type="date" optional hint="Leave empty to start with the current week." />
            </div>
            <FormSelect
              name="scenarioId"
              label="Scenario"
              number
              placeholder="Current data (no scenario)"
              options={scenarios.data.map((s) => ({ value: String(s.id), label: s.name }))}
              hint="A scenario applies its what-if overrides to a copy of the current data."
            />
            <fieldset className="flex flex-col gap-3 rounded border border-line p-3">
              <legend className="px-1 text-sm font-semibold">Smoothing</legend>
              <FormCheckbox name="smoothing.enabled" label="Smooth production from week to week" />
              <FormInput
                name="smoothing.weight"
                label="Smoothing weight (per unit² of change)"
                number="number"
                hint={
                  smoothing
                    ? 'Higher weights trade margin for steadier weekly quantities.'
                    : 'Used only when smoothing is on.'
                }
              />
            </fieldset>
            <FormCheckbox name="wholeUnits" label="Whole units and batch multiples (rounded after the solve, gap to the LP bound reported)" />
          </>
        );
      }}
    </Form>
  );
}
