import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function RangeCheckRoute() {
  return <UpcomingScreen area="range-check" />;
}
