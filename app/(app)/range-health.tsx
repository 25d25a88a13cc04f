import { useLocalSearchParams } from 'expo-router';

import { RangeHealthScreen } from '@/components/screens/RangeHealthScreen';

export default function RangeHealthRoute() {
  const { meterRunId } = useLocalSearchParams<{ meterRunId?: string }>();
  return <RangeHealthScreen meterRunId={meterRunId} />;
}
