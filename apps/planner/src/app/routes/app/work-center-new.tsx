import { WorkCenterNewPage } from '@/features/work-centers';

export default function WorkCenterNewRoute() {
  return <WorkCenterNewPage />;
}
