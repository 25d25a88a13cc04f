import { MeterRunsScreen } from '@/components/screens/MeterRunsScreen';

export default function MeterRunsRoute() {
  return <MeterRunsScreen />;
}
