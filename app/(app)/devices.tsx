import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function DevicesRoute() {
  return <UpcomingScreen area="devices" />;
}
