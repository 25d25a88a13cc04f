import { MailOutboxScreen } from '@/components/screens/MailOutboxScreen';

export default function MailRoute() {
  return <MailOutboxScreen />;
}
