import { useParams } from 'react-router-dom';
import { MaterialEditorPage } from '@/features/materials';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

export default function MaterialRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().materialId);
  if (id === null) return <NotFoundRoute />;
  return <MaterialEditorPage key={id} materialId={id} canEdit={can(me.data?.role, 'write:master-data')} />;
}
