import { DemandPage } from '@/features/demand';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function DemandRoute() {
  const me = useMe();
  return <DemandPage canEdit={can(me.data?.role, 'write:demand')} />;
}
