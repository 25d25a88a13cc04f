import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function LiveBoardRoute() {
  return <UpcomingScreen area="live" />;
}
