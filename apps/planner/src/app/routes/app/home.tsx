import { HomePage } from '@/features/home';
import { useMe } from '@/lib/auth';

export default function HomeRoute() {
  const me = useMe();
  return <HomePage showDemand={me.data?.role !== 'floor_lead'} />;
}
