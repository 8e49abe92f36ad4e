import { ScenarioNewPage } from '@/features/plans/scenarios';

export default function ScenarioNewRoute() {
  return <ScenarioNewPage />;
}
