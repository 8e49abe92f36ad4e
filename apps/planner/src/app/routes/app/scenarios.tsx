import { ScenariosListPage } from '@/features/plans/scenarios';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function ScenariosRoute() {
  const me = useMe();
  return <ScenariosListPage canEdit={can(me.data?.role, 'write:plans')} />;
}
