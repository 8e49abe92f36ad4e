import { PeoplePage } from '@/features/people';
import { useMe } from '@/lib/auth';

export default function PeopleRoute() {
  const me = useMe();
  return <PeoplePage myEmail={me.data?.email ?? ''} />;
}
