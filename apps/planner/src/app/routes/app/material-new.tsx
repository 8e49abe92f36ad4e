import { MaterialNewPage } from '@/features/materials';

export default function MaterialNewRoute() {
  return <MaterialNewPage />;
}
