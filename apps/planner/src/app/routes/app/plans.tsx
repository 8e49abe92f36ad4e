import { PlansListPage } from '@/features/plans';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function PlansRoute() {
  const me = useMe();
  return <PlansListPage canCreate={can(me.data?.role, 'write:plans')} />;
}
