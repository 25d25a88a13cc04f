import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function MeterRunsRoute() {
  return <UpcomingScreen area="meter-runs" />;
}
