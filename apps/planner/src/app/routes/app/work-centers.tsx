import { WorkCentersListPage } from '@/features/work-centers';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function WorkCentersRoute() {
  const me = useMe();
  return <WorkCentersListPage canEdit={can(me.data?.role, 'write:master-data')} />;
}
