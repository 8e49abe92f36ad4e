import { SettingsPage } from '@/features/settings';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function SettingsRoute() {
  const me = useMe();
  return <SettingsPage canEdit={can(me.data?.role, 'write:settings')} />;
}
