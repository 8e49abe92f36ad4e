import { useQueryClient } from '@tanstack/react-query';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { ReadOnlyNote } from '@/components/ui/read-only-note';
import { settingsQueryOptions, useSettings } from './api/get-settings';
import { SettingsForm } from './components/settings-form';

export function SettingsPage({ canEdit }: { canEdit: boolean }) {
  const settings = useSettings();
  const queryClient = useQueryClient();
  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: settingsQueryOptions().queryKey });
    return queryClient.fetchQuery(settingsQueryOptions());
  };
  return (
    <>
      <PageHeader title="Plant settings" description="Currency, week start, default shifts and working-time limits of the plant." />
      {!canEdit ? <ReadOnlyNote who="admins and planners" /> : null}
      {settings.isPending ? <Loading label="Loading settings…" /> : null}
      {settings.isError ? <ErrorState error={settings.error} onRetry={() => void settings.refetch()} /> : null}
      {settings.data ? <SettingsForm settings={settings.data} readOnly={!canEdit} reload={reload} /> : null}
    </>
  );
}
