import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function CorrectionsRoute() {
  return <UpcomingScreen area="corrections" />;
}
