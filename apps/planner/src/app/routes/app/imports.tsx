import { ImportsPage } from '@/features/imports';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function ImportsRoute() {
  const me = useMe();
  return <ImportsPage canImport={can(me.data?.role, 'write:master-data')} />;
}
