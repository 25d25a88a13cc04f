import { DevicesScreen } from '@/components/screens/DevicesScreen';

export default function DevicesRoute() {
  return <DevicesScreen />;
}
