import { useState } from 'react';
import type { Person, Role } from '@millrace/contracts';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { DataTable } from '@/components/ui/table/data-table';
import { usePeople } from './api/get-people';
import { useWorkCenterChoices } from './api/get-work-center-choices';
import { useUpdatePerson } from './api/update-person';
import { peopleColumns } from './components/people-columns';
import { PersonCreateForm } from './components/person-create-form';
import { PersonInviteForm } from './components/person-invite-form';

export function PeoplePage({ myEmail }: { myEmail: string }) {
  const people = usePeople();
  const update = useUpdatePerson();
  const workCenters = useWorkCenterChoices((people.data ?? []).some((p) => p.role === 'floor_lead' || (p.workCenterIds ?? []).length > 0));
  const [busyId, setBusyId] = useState<number | null>(null);
  const [notice, setNotice] = useState<{ kind: 'done' | 'failed'; text: string } | null>(null);

  const save = (person: Person, body: { role?: Role; active?: boolean; workCenterIds?: number[] }, done: string) => {
    setBusyId(person.id);
    setNotice(null);
    update.mutate(
      { id: person.id, body: { ...body, version: person.version } },
      {
        onSuccess: () => setNotice({ kind: 'done', text: done }),
        onError: (error) =>
          setNotice({ kind: 'failed', text: `${person.name} was not changed: ${error instanceof Error ? error.message : 'unknown error'} The list has been reloaded.` }),
        onSettled: () => setBusyId(null),
      },
    );
  };

  const columns = peopleColumns({
    myEmail,
    busyId,
    changeRole: (p, role) => save(p, { role }, `${p.name} is now ${role.replace('_', ' ')}.`),
    setActive: (p, active) => save(p, { active }, active ? `${p.name} can sign in again.` : `${p.name} is deactivated and signed out.`),
    setWorkCenters: (p, workCenterIds) => {
      const codes = (workCenters.data ?? []).filter((c) => workCenterIds.includes(c.id)).map((c) => c.code);
      save(p, { workCenterIds }, codes.length === 0 ? `${p.name} has no work centers now and sees the sheets of all of them.` : `${p.name} now sees the shift sheets of ${codes.join(', ')}.`);
    },
    workCenterChoices: workCenters.data,
    workCenterChoicesError: workCenters.isError ? (workCenters.error instanceof Error ? workCenters.error.message : 'unknown error') : undefined,
  });

  return (
    <>
      <PageHeader title="People" description="Who can sign in, in which role, and which work centers each floor lead sees." />
      <section aria-labelledby="invite-person" className="mb-6 rounded border border-line bg-panel p-4">
        <h2 id="invite-person" className="mb-3 text-lg font-semibold">
          Invite by e-mail
        </h2>
        <PersonInviteForm />
      </section>
      <section aria-labelledby="add-person" className="mb-8 rounded border border-line bg-panel p-4">
        <h2 id="add-person" className="mb-3 text-lg font-semibold">
          Add a person
        </h2>
        <PersonCreateForm />
      </section>
      <div role="status" aria-live="polite">
        {notice ? (
          <p className={`mb-3 rounded border p-2 ${notice.kind === 'done' ? 'border-fine-700 bg-fine-50' : 'border-fault-700 bg-fault-50'}`}>
            <span aria-hidden="true">{notice.kind === 'done' ? '✓ ' : '✕ '}</span>
            {notice.text}
          </p>
        ) : null}
      </div>
      {people.isPending ? <Loading label="Loading people…" /> : null}
      {people.isError ? <ErrorState error={people.error} onRetry={() => void people.refetch()} /> : null}
      {people.data ? (
        <DataTable label="People" columns={columns} data={people.data} getRowId={(p) => String(p.id)} empty={<EmptyState title="Nobody yet" />} />
      ) : null}
    </>
  );
}
