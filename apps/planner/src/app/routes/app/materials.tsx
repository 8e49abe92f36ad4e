import { MaterialsListPage } from '@/features/materials';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function MaterialsRoute() {
  const me = useMe();
  return <MaterialsListPage canEdit={can(me.data?.role, 'write:master-data')} />;
}
