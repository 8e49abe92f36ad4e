import { ChangePasswordPage } from '@/features/auth/components/change-password-page';

export default function ChangePasswordRoute() {
  return <ChangePasswordPage />;
}
