import { useParams } from 'react-router-dom';
import { PlanResultsPage } from '@/features/plans/results';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

/** The results route: the only one that loads the charts library. */
export default function PlanResultsRoute() {
  const id = parseIdParam(useParams().planId);
  if (id === null) return <NotFoundRoute />;
  return <PlanResultsPage key={id} planId={id} />;
}
