import { useSearchParams } from 'react-router-dom';
import { ResetPasswordPage } from '@/features/auth/components/reset-password-page';

export default function ResetPasswordRoute() {
  const [params] = useSearchParams();
  return <ResetPasswordPage token={params.get('token') ?? ''} />;
}
