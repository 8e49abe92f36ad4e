import { MailPage } from '@/features/mail';

export default function MailRoute() {
  return <MailPage />;
}
