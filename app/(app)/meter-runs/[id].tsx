import { useLocalSearchParams } from 'expo-router';

import { MeterRunScreen } from '@/components/screens/MeterRunScreen';

export default function MeterRunRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  // A new meter run is a new screen: its window, contract day and caches start afresh.
  return <MeterRunScreen key={id} meterRunId={String(id)} />;
}
