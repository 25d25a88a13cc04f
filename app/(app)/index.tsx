import { LiveBoardScreen } from '@/components/screens/LiveBoardScreen';

export default function LiveBoardRoute() {
  return <LiveBoardScreen />;
}
