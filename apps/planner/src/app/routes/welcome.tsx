import { useSearchParams } from 'react-router-dom';
import { WelcomePage } from '@/features/auth/components/welcome-page';

export default function WelcomeRoute() {
  const [params] = useSearchParams();
  return <WelcomePage token={params.get('token') ?? ''} />;
}
