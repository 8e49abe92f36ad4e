import { useParams } from 'react-router-dom';
import { ProductEditorPage } from '@/features/products';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';
import { parseIdParam } from './parse-id-param';
import NotFoundRoute from './not-found';

export default function ProductRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().productId);
  if (id === null) return <NotFoundRoute />;
  return <ProductEditorPage key={id} productId={id} canEdit={can(me.data?.role, 'write:master-data')} />;
}
