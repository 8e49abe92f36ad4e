import { useParams } from 'react-router-dom';
import { PlanPage } from '@/features/plans';
import { useMe } from '@/lib/auth';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

export default function PlanRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().planId);
  if (id === null || !me.data) return <NotFoundRoute />;
  return <PlanPage key={id} planId={id} role={me.data.role} />;
}
