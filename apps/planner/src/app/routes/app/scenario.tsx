import { useParams } from 'react-router-dom';
import { ScenarioEditorPage } from '@/features/plans/scenarios';
import { useMe } from '@/lib/auth';
import { can } from '@/lib/authorization';
import NotFoundRoute from './not-found';
import { parseIdParam } from './parse-id-param';

export default function ScenarioRoute() {
  const me = useMe();
  const id = parseIdParam(useParams().scenarioId);
  if (id === null) return <NotFoundRoute />;
  return <ScenarioEditorPage key={id} scenarioId={id} canEdit={can(me.data?.role, 'write:plans')} />;
}
