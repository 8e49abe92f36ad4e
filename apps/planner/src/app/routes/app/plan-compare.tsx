import { PlanComparePage } from '@/features/plans/compare';

export default function PlanCompareRoute() {
  return <PlanComparePage />;
}
