import { useParams } from 'react-router-dom';
import { WorkCenterEditorPage } from '@/features/work-centers';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

export default function WorkCenterRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().workCenterId);
  if (id === null) return <NotFoundRoute />;
  return <WorkCenterEditorPage key={id} workCenterId={id} canEdit={can(me.data?.role, 'write:master-data')} />;
}
