import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function ImportsRoute() {
  return <UpcomingScreen area="imports" />;
}
