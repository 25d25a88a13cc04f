import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function AlarmsRoute() {
  return <UpcomingScreen area="alarms" />;
}
