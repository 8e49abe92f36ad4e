import { useParams } from 'react-router-dom';
import { PlanReviewPage } from '@/features/plans/review';
import { useMe } from '@/lib/auth';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

export default function PlanReviewRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().planId);
  if (id === null || !me.data) return <NotFoundRoute />;
  return <PlanReviewPage key={id} planId={id} role={me.data.role} />;
}
