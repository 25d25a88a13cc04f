import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function TotalsRoute() {
  return <UpcomingScreen area="totals" />;
}
