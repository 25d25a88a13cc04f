import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function SetupRoute() {
  return <UpcomingScreen area="setup" />;
}
