import { PlanNewPage } from '@/features/plans';

export default function PlanNewRoute() {
  return <PlanNewPage />;
}
