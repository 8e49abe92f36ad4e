import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Form, FormInput } from '@/components/ui/form';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { ReadOnlyNote } from '@/components/ui/read-only-note';
import { DataTable } from '@/components/ui/table/data-table';
import { paths } from '@/config/paths';
import { useMasterChoices } from '../api/get-master-choices';
import { scenarioQueryOptions, useScenario } from '../api/get-scenario';
import { useScenarios } from '../api/get-scenarios';
import { scenarioCreateSchema, scenarioUpdateSchema, useCreateScenario, useDeleteScenario, useUpdateScenario } from '../api/save-scenario';
import { OverridesEditor } from './components/overrides-editor';
import { scenariosColumns } from './components/scenarios-columns';

const newLinkClass = 'rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800';

/** Named what-if copies of the plant's data, used when creating a plan version. */
export function ScenariosListPage({ canEdit }: { canEdit: boolean }) {
  const scenarios = useScenarios();
  const newLink = canEdit ? (
    <Link className={newLinkClass} to={paths.scenarioNew.getHref()}>
      New scenario
    </Link>
  ) : null;
  return (
    <>
      <PageHeader title="Scenarios" description="What-if overrides on the current data: extra shifts, supply cuts, demand changes, maintenance." actions={newLink} />
      {scenarios.isPending ? <Loading label="Loading scenarios…" /> : null}
      {scenarios.isError ? <ErrorState error={scenarios.error} onRetry={() => void scenarios.refetch()} /> : null}
      {scenarios.data ? (
        <DataTable
          label="Scenarios"
          columns={scenariosColumns}
          data={scenarios.data}
          getRowId={(s) => String(s.id)}
          empty={
            <EmptyState title="No scenarios yet" action={newLink}>
              A scenario lets you plan “what if” without touching the master data.
            </EmptyState>
          }
        />
      ) : null}
    </>
  );
}

function ScenarioBody({ readOnly }: { readOnly: boolean }) {
  const choices = useMasterChoices();
  return (
    <>
      <FormInput name="name" label="Name" />
      <FormInput name="description" label="Description" />
      {choices.isPending ? <Loading label="Loading work centers, materials and products…" /> : null}
      {choices.isError ? <ErrorState error={choices.error} onRetry={() => void choices.refetch()} /> : null}
      {choices.data ? <OverridesEditor choices={choices.data} readOnly={readOnly} /> : null}
    </>
  );
}

export function ScenarioNewPage() {
  const create = useCreateScenario();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="New scenario"
        description={
          <Link className="text-race-700 underline" to={paths.scenarios.getHref()}>
            Back to scenarios
          </Link>
        }
      />
      <Form
        schema={scenarioCreateSchema}
        defaultValues={{ name: '', description: '', overrides: [] }}
        label="New scenario"
        submitLabel="Create scenario"
        savedMessage="Scenario created."
        onSubmit={async (values) => {
          const s = await create.mutateAsync(values);
          void navigate(paths.scenario.getHref(s.id));
        }}
      >
        <ScenarioBody readOnly={false} />
      </Form>
    </>
  );
}

type ScenarioFormValues = z.input<typeof scenarioUpdateSchema>;

export function ScenarioEditorPage({ scenarioId, canEdit }: { scenarioId: number; canEdit: boolean }) {
  const scenario = useScenario(scenarioId);
  const update = useUpdateScenario();
  const remove = useDeleteScenario();
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  if (scenario.isPending) return <Loading label="Loading the scenario…" />;
  if (scenario.isError) return <ErrorState error={scenario.error} onRetry={() => void scenario.refetch()} />;
  const s = scenario.data;
  const readOnly = !canEdit || s.locked;
  const toValues = (x: typeof s): ScenarioFormValues => ({ name: x.name, description: x.description, overrides: x.overrides, version: x.version });

  return (
    <>
      <PageHeader
        title={`Scenario: ${s.name}`}
        description={
          <Link className="text-race-700 underline" to={paths.scenarios.getHref()}>
            All scenarios
          </Link>
        }
        actions={
          canEdit && !s.locked ? (
            <Button
              variant="danger"
              busy={remove.isPending}
              busyLabel="Deleting…"
              disabled={s.usedByPlanIds.length > 0}
              title={s.usedByPlanIds.length > 0 ? 'Plan versions were built from it.' : undefined}
              onClick={() => {
                if (window.confirm(`Delete the scenario “${s.name}”?`)) remove.mutate(s.id, { onSuccess: () => void navigate(paths.scenarios.getHref()) });
              }}
            >
              Delete scenario
            </Button>
          ) : undefined
        }
      />
      {!canEdit ? <ReadOnlyNote who="planners" /> : null}
      {canEdit && s.locked ? (
        <p role="note" className="mb-4 rounded border border-line bg-race-50 px-3 py-2 text-sm">
          <span className="font-semibold">Read only:</span> an approved or released plan version was built from this scenario. Copy it into a new scenario to change it.
        </p>
      ) : null}
      {remove.isError ? <ErrorState error={remove.error} title="Not deleted" /> : null}
      {s.usedByPlanIds.length > 0 ? <p className="mb-3 text-sm text-ink-soft">Used by plan versions {s.usedByPlanIds.map((id) => `#${id}`).join(', ')}.</p> : null}
      <Form
        schema={scenarioUpdateSchema}
        defaultValues={toValues(s)}
        label={`Scenario ${s.name}`}
        submitLabel="Save scenario"
        readOnly={readOnly}
        onSubmit={async (values) => toValues(await update.mutateAsync({ id: s.id, body: values }))}
        onReload={async () => {
          await queryClient.invalidateQueries({ queryKey: scenarioQueryOptions(s.id).queryKey });
          return toValues(await queryClient.fetchQuery(scenarioQueryOptions(s.id)));
        }}
      >
        <ScenarioBody readOnly={readOnly} />
      </Form>
    </>
  );
}
