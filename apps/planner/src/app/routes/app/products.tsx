import { ProductsListPage } from '@/features/products';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';

export default function ProductsRoute() {
  const me = useMe();
  return <ProductsListPage canEdit={can(me.data?.role, 'write:master-data')} />;
}
