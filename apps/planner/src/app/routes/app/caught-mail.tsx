import { CaughtMailPage } from '@/features/caught-mail';

export default function CaughtMailRoute() {
  return <CaughtMailPage />;
}
