import { useLocalSearchParams } from 'expo-router';

import { TransmitterCalibrationsScreen } from '@/components/calibrations/TransmitterCalibrationsScreen';

export default function TransmitterRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <TransmitterCalibrationsScreen key={id} transmitterId={String(id)} />;
}
